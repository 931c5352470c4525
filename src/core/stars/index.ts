export { makeImf, imfDensity, imfNumber, imfMass, imfMeanMass } from './imf.js';
export type { Imf, ImfSegment } from './imf.js';
export {
  IMF_PRESETS,
  IMF_NAMES,
  resolveImf,
  isTopHeavy,
  parseCustomImf,
  chabrierSegments,
  cmbHeatedSegments,
  gasTemperatureK,
  SALPETER_SEGMENTS,
  KROUPA_SEGMENTS,
  TOP_HEAVY_FLAT_SEGMENTS,
} from './imf-presets.js';
export type { ImfPreset } from './imf-presets.js';
export { mainSequenceLifetimeMyr } from './lifetime.js';
export { zamsLuminosityLsun, zamsRadiusRsun, effectiveTemperatureK } from './zams.js';
export { remnantMassMsun } from './remnant.js';
export { blackbodyLnu } from './blackbody.js';
export { balmerJumpDex } from './balmer-jump.js';
export { stellarLnu, atmosphereAt, emittingTemperatureK, atmosphereFluxRatio, atmosphereOpacityRatios } from './stellar-atmosphere.js';
export type { AtmosphereRatios } from './stellar-atmosphere.js';
export { intrinsicUvSlope, UV_SLOPE_LAMBDA_MIN_UM, UV_SLOPE_LAMBDA_MAX_UM } from './intrinsic-uv-slope.js';
export { cumulativeYoungerThan, currentSfrPerMassFormed, parseSfh, validateSfh, SFH_NAMES } from './sfh.js';
export type { Sfh } from './sfh.js';
export { makePopulation } from './population.js';
export type { Population, PopulationOptions, Phases } from './population.js';
export { makeMassToLightTable, ML_AGE_MIN_MYR, ML_AGE_MAX_MYR } from './mass-to-light.js';
export type { MassToLightTable } from './mass-to-light.js';
export { makePopulationCache } from './population-cache.js';
export type { PopulationCache } from './population-cache.js';
export {
  abToFnu,
  lnuFromApparent,
  log10LnuFromApparent,
  lnuFromAbsolute,
  absoluteFromApparent,
  apparentFromAbsolute,
  restWavelengthUm,
  MODEL_LAMBDA_MIN_UM,
  MODEL_LAMBDA_MAX_UM,
} from './photometry.js';
export { calzettiK, meurerA1600, attenuationMag, attenuationFromBeta } from './dust.js';
export type { DustSpec } from './dust.js';
export { estimateMass, rescaleMass, observedLnu, intrinsicLnu, allowedAgesMyr, MUV_REST_UM } from './mass-estimate.js';
export type { Brightness, MassEstimate } from './mass-estimate.js';

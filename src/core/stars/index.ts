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
export { zamsLuminosityLsun, zamsRadiusRsun, effectiveTemperatureK, surfaceLogG } from './zams.js';
export { remnantMassMsun } from './remnant.js';
export { blackbodyLnu } from './blackbody.js';
export { balmerJumpDex, BALMER_EDGE_UM } from './balmer-jump.js';
export { stellarLnu, photosphereAt, photosphereFluxRatio, opacityRatio, nonGreyWeight, NON_GREY_FROM_K, NON_GREY_FULL_K } from './stellar-atmosphere.js';
export type { Photosphere } from './stellar-atmosphere.js';
export { fluxKernelIntegral, fluxKernel } from './formal-solution.js';
export { expIntegralE1, expIntegralE2 } from './exponential-integral.js';
export { continuousOpacity, rosselandMean, photosphericLayer } from './continuous-opacity.js';
export { gasState, hydrogenSahaFactor, hMinusSahaFactor, hydrogenMassFraction } from './gas-state.js';
export type { GasState } from './gas-state.js';
export {
  KRAMERS_BF_CM2_HZ3,
  KRAMERS_FF_CGS,
  gauntBoundFree,
  gauntFreeFree,
  hydrogenBoundFreeCrossSection,
  hydrogenEdgeAngstrom,
  hydrogenAbsorption,
} from './hydrogen-opacity.js';
export { hMinusAbsorption, hMinusBoundFreeCrossSection, hMinusFreeFreePerPe, HMINUS_THRESHOLD_ANGSTROM } from './negative-hydrogen-opacity.js';
export { intrinsicUvSlope, UV_SLOPE_LAMBDA_MIN_UM, UV_SLOPE_LAMBDA_MAX_UM } from './intrinsic-uv-slope.js';
export { cumulativeYoungerThan, currentSfrPerMassFormed, parseSfh, validateSfh, SFH_NAMES } from './sfh.js';
export type { Sfh } from './sfh.js';
export { makePopulation } from './population.js';
export { starState, postTrack, MS_LUMINOSITY_FACTOR, MS_RADIUS_FACTOR, POST_MS_DURATION, POST_MS_LUMINOSITY_FACTOR, POST_MS_TEFF_K, POST_MS_TEFF_MASSIVE_K, POST_MS_MASSIVE_MSUN } from './stellar-phases.js';
export type { StarState, Track } from './stellar-phases.js';
export { spectralLibrary } from './stellar-spectra.js';
export type { SpectralLibrary } from './stellar-spectra.js';
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

/**
 * Writes everything the numpy comparison script (numpy_audit.py) needs to do the tool's per-draw work
 * on the benchmark sample: the galaxies, the tool's own tables (ln D_L and ln t on ln(1+z), the M/L
 * tables of each IMF, the ceiling's nodes without and with cosmic variance, the accretion history's
 * G(u)) and the constants, so both sides read the same physics and differ only in how they compute.
 */
import { writeFileSync } from 'node:fs';
import { makeAccretionHistory, prepareAudit } from '../../src/core/audit/index.js';
import { fastBackground } from '../../src/core/audit/galaxy-draws.js';
import { AB_ZERO_POINT, MPC_CM, LYMAN_ALPHA_UM } from '../../src/core/constants.js';
import { MUV_REST_UM } from '../../src/core/stars/mass-estimate.js';
import { apparentFromAbsolute, MODEL_LAMBDA_MAX_UM } from '../../src/core/stars/photometry.js';
import { benchChoices, sample } from './audit-sample.js';

export function writeNumpyInputs(rows: number, draws: number, file: string): void {
  const choices = { ...benchChoices, draws };
  const prep = prepareAudit(sample(rows), choices);
  const { ctx } = prep;
  const bg = ctx.halo.background;
  const fb = fastBackground(bg);
  const ceil = ctx.ceilingFor(undefined);
  const hist = makeAccretionHistory(bg);
  const nodeZ: number[] = [];
  for (let j = 0; j <= 130; j++) {
    const z = Math.round((1 + j * 0.1) * 10) / 10;
    try {
      ceil.log10HaloMassAtQuantile(z);
      nodeZ.push(z);
    } catch {
      /* outside the ceiling table */
    }
  }
  const sigmas = new Map<number, number[]>();
  const galaxies = Array.from({ length: prep.parsed.rowCount }, (_, i) => prep.parsed.rowAt(i)).filter((r) => r.status === 'ok').map((r) => {
    const g = r.galaxy!;
    const sigmaDm = ctx.sigmaDmFor(undefined, g.z);
    if (!sigmas.has(sigmaDm)) sigmas.set(sigmaDm, nodeZ.map((z) => ceil.log10HaloMassAtQuantileCv(z, sigmaDm)));
    return {
      id: g.id, z: g.z, s_lo: g.z - g.zLo!, s_hi: g.zHi! - g.z, m_app: apparentFromAbsolute(g.muv!, bg.luminosityDistanceMpc(g.z), g.z),
      lambda_obs_um: MUV_REST_UM * (1 + g.z), mag_err: g.magErr, beta: g.beta!, sigma_dm: sigmaDm, cosmo_sd_dex: ctx.ceilingSdDexAt(undefined, g.z),
    };
  });
  const uTop = Math.log1p(200);
  const gU = Array.from({ length: 2001 }, (_, i) => (i * uTop) / 2000);
  const k = (0.1 * 46.1 * bg.hubbleTimeGyr * 1e9) / 1e12;
  // G(z) − G(0) from the history itself: y(z) = 1 + k [G(z) − G(0)] for a 1e12 Msun halo at z = 0.
  const gTab = gU.map((u) => ((hist.massAt(1e12, 0, Math.expm1(u)) / 1e12) ** -0.1 - 1) / k);
  const tables = Object.fromEntries(choices.imfs.map((imf) => {
    const t = ctx.cache.table(imf, 9, ctx.sfh);
    return [imf, { n_age: t.nAge, n_lam: t.nLam, log10_age_min: t.log10AgeMin, log10_age_max: t.log10AgeMax, log10_lam_min: t.log10LamMin, log10_lam_max: t.log10LamMax, log_lnu: Array.from(t.logLnu), log_surv: Array.from(t.logSurv) }];
  }));
  writeFileSync(file, JSON.stringify({
    draws, imfs: choices.imfs, headline: choices.imfs[0], eps_ref: choices.epsRef, formation_z: choices.formationZ,
    log10_fb: Math.log10(ctx.halo.baryonFraction),
    lnu_const: Math.log10(4 * Math.PI * MPC_CM * MPC_CM) - 0.4 * AB_ZERO_POINT,
    lyman_alpha_um: LYMAN_ALPHA_UM, model_lambda_max_um: MODEL_LAMBDA_MAX_UM,
    bg: { x0: fb.x0, h: fb.h, ln_dl: Array.from(fb.lnDl), ln_age: Array.from(fb.lnAge), age_form_gyr: bg.ageGyr(choices.formationZ) },
    ceiling: { z: nodeZ, log10_m: nodeZ.map((z) => ceil.log10HaloMassAtQuantile(z)), cv: Object.fromEntries([...sigmas].map(([s, v]) => [String(s), v])) },
    accretion: { u: gU, g: gTab, k },
    tables, galaxies,
  }));
}

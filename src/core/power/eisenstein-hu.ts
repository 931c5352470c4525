import type { CosmologyParams } from '../cosmology/params.js';

/**
 * Eisenstein & Hu 1998, ApJ 496, 605: transfer function of CDM + baryons, with the baryon
 * acoustic oscillations (eqs. 2–24) and the no-wiggle form (eqs. 26, 28–31). k in Mpc⁻¹ (no h).
 * Inputs: ω_m = Ω_m h², f_b = Ω_b/Ω_m, Θ = T_CMB/2.7 K (EH98 has no neutrinos).
 */
export interface EisensteinHuScales {
  /** 1 + z_eq (eq. 2). */
  readonly onePlusZeq: number;
  /** k_eq, Mpc⁻¹ (eq. 3). */
  readonly kEq: number;
  /** z_d, drag epoch (eq. 4). */
  readonly zDrag: number;
  /** R at drag and at equality (eq. 5). */
  readonly rDrag: number;
  readonly rEq: number;
  /** Sound horizon at the drag epoch from eq. 6, Mpc. */
  readonly soundHorizonMpc: number;
  /** Approximate sound horizon of eq. 26, Mpc. */
  readonly soundHorizonFitMpc: number;
  /** Silk damping scale, Mpc⁻¹ (eq. 7). */
  readonly kSilk: number;
  readonly alphaC: number;
  readonly betaC: number;
  readonly alphaB: number;
  readonly betaB: number;
  readonly betaNode: number;
}

function inputs(p: CosmologyParams): { om: number; ob: number; fb: number; theta: number; h: number } {
  const h = p.h0 / 100;
  const theta = (p.tcmbK > 0 ? p.tcmbK : 2.7255) / 2.7;
  return { om: p.omegaM * h * h, ob: p.omegaB * h * h, fb: p.omegaB / p.omegaM, theta, h };
}

export function eisensteinHuScales(p: CosmologyParams): EisensteinHuScales {
  const { om, ob, fb, theta } = inputs(p);
  const fc = 1 - fb;
  const t2 = theta * theta;
  const onePlusZeq = (2.5e4 * om) / (t2 * t2); // eq. 2 (the authors' code: "really 1+z")
  const kEq = (7.46e-2 * om) / t2; // eq. 3
  const b1 = 0.313 * om ** -0.419 * (1 + 0.607 * om ** 0.674); // eq. 4
  const b2 = 0.238 * om ** 0.223;
  const zDrag = ((1291 * om ** 0.251) / (1 + 0.659 * om ** 0.828)) * (1 + b1 * ob ** b2);
  const rConst = (31.5 * ob) / (t2 * t2); // eq. 5
  const rDrag = (rConst * 1000) / (1 + zDrag);
  const rEq = (rConst * 1000) / onePlusZeq;
  const s = ((2 / (3 * kEq)) * Math.sqrt(6 / rEq) * Math.log((Math.sqrt(1 + rDrag) + Math.sqrt(rDrag + rEq)) / (1 + Math.sqrt(rEq)))); // eq. 6
  const kSilk = 1.6 * ob ** 0.52 * om ** 0.73 * (1 + (10.4 * om) ** -0.95); // eq. 7
  const a1 = (46.9 * om) ** 0.67 * (1 + (32.1 * om) ** -0.532); // eq. 11
  const a2 = (12.0 * om) ** 0.424 * (1 + (45.0 * om) ** -0.582);
  const alphaC = a1 ** -fb * a2 ** -(fb ** 3);
  const bb1 = 0.944 / (1 + (458 * om) ** -0.708); // eq. 12
  const bb2 = (0.395 * om) ** -0.0266;
  const betaC = 1 / (1 + bb1 * (fc ** bb2 - 1));
  const y = onePlusZeq / (1 + zDrag);
  const sq = Math.sqrt(1 + y);
  const G = y * (-6 * sq + (2 + 3 * y) * Math.log((sq + 1) / (sq - 1))); // eq. 15
  const alphaB = 2.07 * kEq * s * (1 + rDrag) ** -0.75 * G; // eq. 14
  const betaB = 0.5 + fb + (3 - 2 * fb) * Math.sqrt((17.2 * om) ** 2 + 1); // eq. 24
  const betaNode = 8.41 * om ** 0.435; // eq. 23
  const soundHorizonFitMpc = (44.5 * Math.log(9.83 / om)) / Math.sqrt(1 + 10 * ob ** 0.75); // eq. 26
  return { onePlusZeq, kEq, zDrag, rDrag, rEq, soundHorizonMpc: s, soundHorizonFitMpc, kSilk, alphaC, betaC, alphaB, betaB, betaNode };
}

/** T̃0(k; α, β) of EH98 eqs. 19–20, with q = k/(13.41 k_eq) (eq. 10). */
function tTilde(q: number, alpha: number, beta: number): number {
  const l = Math.log(Math.E + 1.8 * beta * q);
  const c = 14.2 / alpha + 386 / (1 + 69.9 * q ** 1.08);
  return l / (l + c * q * q);
}

/** Full EH98 transfer function T(k) (eq. 16 = f_b T_b + f_c T_c), k in Mpc⁻¹. */
export function makeEisensteinHu(p: CosmologyParams): (kMpc: number) => number {
  const sc = eisensteinHuScales(p);
  const fb = p.omegaB / p.omegaM;
  const fc = 1 - fb;
  const s = sc.soundHorizonMpc;
  return (k: number): number => {
    const q = k / (13.41 * sc.kEq);
    const ks = k * s;
    const f = 1 / (1 + (ks / 5.4) ** 4); // eq. 18
    const tc = f * tTilde(q, 1, sc.betaC) + (1 - f) * tTilde(q, sc.alphaC, sc.betaC); // eq. 17
    const sTilde = s / Math.cbrt(1 + (sc.betaNode / ks) ** 3); // eq. 22
    const x = k * sTilde;
    const j0 = x < 1e-8 ? 1 : Math.sin(x) / x;
    const tb =
      (tTilde(q, 1, 1) / (1 + (ks / 5.2) ** 2) + (sc.alphaB / (1 + (sc.betaB / ks) ** 3)) * Math.exp(-((k / sc.kSilk) ** 1.4))) * j0; // eq. 21
    return fb * tb + fc * tc;
  };
}

/** EH98 no-wiggle transfer function (eqs. 26, 28–31), k in Mpc⁻¹; q = k Θ² / (Γ_eff h). */
export function makeEisensteinHuNoWiggle(p: CosmologyParams): (kMpc: number) => number {
  const { om, ob, fb, theta, h } = inputs(p);
  const s = (44.5 * Math.log(9.83 / om)) / Math.sqrt(1 + 10 * ob ** 0.75); // eq. 26
  const alphaG = 1 - 0.328 * Math.log(431 * om) * fb + 0.38 * Math.log(22.3 * om) * fb * fb; // eq. 31
  return (k: number): number => {
    const gammaEff = p.omegaM * h * (alphaG + (1 - alphaG) / (1 + (0.43 * k * s) ** 4)); // eq. 30
    const q = (k * theta * theta) / (gammaEff * h);
    const l0 = Math.log(2 * Math.E + 1.8 * q); // eq. 28
    const c0 = 14.2 + 731 / (1 + 62.5 * q);
    return l0 / (l0 + c0 * q * q); // eq. 29
  };
}

import { BASE_PARAM_KEYS, BASE_PARAM_SPECS, type BaseParamKey, type BaseParams } from './base-params.js';
import { PRESET_UNCERTAINTIES } from './presets.js';

/**
 * A covariance of the base parameters (ω_b, ω_c, H0 in km/s/Mpc, n_s, σ8), rows and columns in
 * BASE_PARAM_KEYS order, entries in the products of those units (H0 entries in (km/s/Mpc)²).
 */
export interface ParamCovariance {
  readonly matrix: readonly (readonly number[])[];
  /** Where it comes from (a preset's paper and column, or a file name). */
  readonly source: string;
}

const N = BASE_PARAM_KEYS.length;
const nameOf = (i: number): string => BASE_PARAM_SPECS[BASE_PARAM_KEYS[i]].name;
/** Relative tolerance of the symmetry, correlation and semi-definiteness checks (rounding of printed numbers). */
const TOL = 1e-9;

/** Independent base parameters with the given 1σ errors: C = diag(σ²). */
export function diagonalCovariance(sd: BaseParams, source: string): ParamCovariance {
  const m = BASE_PARAM_KEYS.map((k, i) => BASE_PARAM_KEYS.map((_, j) => (i === j ? sd[k] * sd[k] : 0)));
  return { matrix: m, source };
}

/** The default uncertainty of a preset: its source's 1σ errors on independent base parameters. */
export function presetCovariance(preset: string): ParamCovariance {
  const u = PRESET_UNCERTAINTIES[preset];
  if (!u) throw new RangeError(`no parameter uncertainties for cosmology preset "${preset}" (known: ${Object.keys(PRESET_UNCERTAINTIES).join(', ')}); give a covariance file instead`);
  return diagonalCovariance(u.sd, `${u.source}; base parameters taken as independent`);
}

/** 1σ of each base parameter, √C_ii. */
export function covarianceSd(cov: ParamCovariance): BaseParams {
  const out = {} as Record<BaseParamKey, number>;
  BASE_PARAM_KEYS.forEach((k, i) => (out[k] = Math.sqrt(cov.matrix[i][i])));
  return out;
}

/** One reason a matrix is not a usable covariance: the parameters naming its row and column (file names), why. */
export interface CovarianceProblem {
  readonly row: string | null;
  readonly column: string | null;
  readonly message: string;
}

const say = (q: CovarianceProblem): string => (q.row ? `row ${q.row}, column ${q.column}: ` : '') + q.message;

/**
 * Problems that stop a matrix from being a covariance of the base parameters, each naming its row and
 * column: wrong shape, non-finite entries, asymmetry beyond 1e-9 √(C_ii C_jj), a negative variance,
 * a correlation beyond ±1, or a negative direction (not positive semi-definite; found by a Cholesky
 * factorisation of the correlation matrix). Empty when it is usable.
 */
export function covarianceProblems(matrix: readonly (readonly number[])[]): CovarianceProblem[] {
  const p: CovarianceProblem[] = [];
  const at = (i: number, j: number, message: string): void => void p.push({ row: nameOf(i), column: nameOf(j), message });
  if (matrix.length !== N || matrix.some((r) => r.length !== N)) return [{ row: null, column: null, message: `a base-parameter covariance is ${N}×${N} (${BASE_PARAM_KEYS.map((_, i) => nameOf(i)).join(', ')})` }];
  for (let i = 0; i < N; i++) for (let j = 0; j < N; j++) if (!Number.isFinite(matrix[i][j])) at(i, j, `entry must be a finite number (got ${matrix[i][j]})`);
  if (p.length) return p;
  for (let i = 0; i < N; i++) if (matrix[i][i] < 0) at(i, i, `a variance cannot be negative (got ${matrix[i][i]})`);
  if (p.length) return p;
  for (let i = 0; i < N; i++) {
    for (let j = i + 1; j < N; j++) {
      const a = matrix[i][j];
      const b = matrix[j][i];
      const s = Math.sqrt(matrix[i][i] * matrix[j][j]);
      if (Math.abs(a - b) > TOL * Math.max(s, Math.abs(a), Math.abs(b))) at(i, j, `${a} differs from row ${nameOf(j)}, column ${nameOf(i)} (${b}); a covariance is symmetric`);
      else if (Math.abs(a) > s * (1 + TOL)) at(i, j, `|covariance| ${Math.abs(a)} exceeds √(C_ii C_jj) = ${s.toPrecision(6)} (a correlation beyond ±1)`);
    }
  }
  if (p.length) return p;
  const c = cholesky(matrix);
  return 'problem' in c ? [c.problem] : [];
}

/** Throws a RangeError listing every problem (see covarianceProblems); returns the covariance otherwise. */
export function assertCovariance(cov: ParamCovariance): ParamCovariance {
  const p = covarianceProblems(cov.matrix);
  if (p.length) throw new RangeError(`${cov.source}: ${p.map(say).join('; ')}`);
  return cov;
}

/**
 * Lower-triangular L with L Lᵀ = C for a positive semi-definite C (Cholesky–Banachiewicz on the
 * correlation matrix R = D^-½ C D^-½, L = D^½ L_R; zero variances and pivots within 1e-9 of zero give
 * zero columns, e.g. Golub & Van Loan, Matrix Computations, §4.2). Throws naming the row and column
 * at which a negative direction shows.
 */
export function choleskyLower(matrix: readonly (readonly number[])[]): number[][] {
  const c = cholesky(matrix);
  if ('problem' in c) throw new RangeError(say(c.problem));
  return c.L;
}

function cholesky(matrix: readonly (readonly number[])[]): { L: number[][] } | { problem: CovarianceProblem } {
  const bad = (i: number, j: number, message: string) => ({ problem: { row: nameOf(i), column: nameOf(j), message } });
  const sd = matrix.map((r, i) => Math.sqrt(Math.max(0, r[i])));
  const R = matrix.map((r, i) => r.map((v, j) => (sd[i] > 0 && sd[j] > 0 ? v / (sd[i] * sd[j]) : 0)));
  for (let i = 0; i < N; i++) {
    for (let j = 0; j < N; j++) {
      if ((sd[i] === 0 || sd[j] === 0) && matrix[i][j] !== 0) return bad(i, j, `covariance ${matrix[i][j]} with a parameter of zero variance; the matrix is not positive semi-definite`);
    }
  }
  const L: number[][] = Array.from({ length: N }, () => new Array<number>(N).fill(0));
  for (let j = 0; j < N; j++) {
    if (sd[j] === 0) continue;
    let d = R[j][j];
    for (let k = 0; k < j; k++) d -= L[j][k] * L[j][k];
    if (d < -TOL) {
      return bad(j, j, `the covariance is not positive semi-definite (the block of ${BASE_PARAM_KEYS.slice(0, j + 1).map((_, i) => nameOf(i)).join(', ')} has a negative eigenvalue)`);
    }
    const ljj = d > TOL ? Math.sqrt(d) : 0;
    L[j][j] = ljj;
    for (let i = j + 1; i < N; i++) {
      let s = R[i][j];
      for (let k = 0; k < j; k++) s -= L[i][k] * L[j][k];
      if (ljj === 0) {
        if (Math.abs(s) > 10 * Math.sqrt(TOL)) return bad(i, j, `the covariance is not positive semi-definite (${nameOf(j)} is fixed by the parameters before it, yet correlates with ${nameOf(i)} beyond them)`);
        L[i][j] = 0;
      } else L[i][j] = s / ljj;
    }
  }
  return { L: L.map((r, i) => r.map((v) => v * sd[i])) };
}

/** A draw of the base-parameter offsets, L g for standard normals g (multivariate normal with covariance L Lᵀ). */
export function drawBaseDelta(L: readonly (readonly number[])[], normal: () => number): BaseParams {
  const g = BASE_PARAM_KEYS.map(() => normal());
  const out = {} as Record<BaseParamKey, number>;
  BASE_PARAM_KEYS.forEach((k, i) => {
    let s = 0;
    for (let j = 0; j <= i; j++) s += L[i][j] * g[j];
    out[k] = s;
  });
  return out;
}

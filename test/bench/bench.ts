/**
 * Benchmarks of the numeric core, the population tables and the audit. Prints medians, the
 * targets, and how cost grows with the work (log–log slope over three or more sizes).
 * Run with `npm run bench`. Nothing here is a test: no thresholds fail the run.
 */
import os, { tmpdir } from 'node:os';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { spawnSync } from 'node:child_process';
import { PLANCK18, makeBackground } from '../../src/core/cosmology/index.js';
import { makeHaloModel } from '../../src/core/halos/index.js';
import { makeLinearPower, makeSigmaTable } from '../../src/core/power/index.js';
import { estimateMass, makeMassToLightTable, makePopulationCache, parseSfh } from '../../src/core/stars/index.js';
import { parseSample, runAudit, type AuditChoices } from '../../src/core/audit/index.js';
import { benchChoices, nearChoices, nearThresholdSample, sample } from './audit-sample.js';
import { P_CLASS_CHANGE_MAX } from '../../src/core/audit/draw-rule.js';
import { writeNumpyInputs } from './numpy-inputs.js';

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : 0.5 * (s[m - 1] + s[m]);
}
function time(fn: () => void, reps: number): number {
  const t: number[] = [];
  for (let i = 0; i < reps; i++) {
    const t0 = performance.now();
    fn();
    t.push(performance.now() - t0);
  }
  return median(t);
}
function slope(sizes: number[], times: number[]): number {
  const x = sizes.map(Math.log);
  const y = times.map(Math.log);
  const mx = x.reduce((a, b) => a + b) / x.length;
  const my = y.reduce((a, b) => a + b) / y.length;
  let num = 0;
  let den = 0;
  x.forEach((xi, i) => {
    num += (xi - mx) * (y[i] - my);
    den += (xi - mx) ** 2;
  });
  return num / den;
}
const rows: string[][] = [];
function report(name: string, ms: number, target: string, extra = ''): void {
  rows.push([name, ms < 1 ? `${(ms * 1000).toFixed(2)} µs` : `${ms.toFixed(1)} ms`, target, extra]);
  console.log(`${name.padEnd(58)} ${rows[rows.length - 1][1].padStart(12)}   target ${target}${extra ? '   ' + extra : ''}`);
}

/** BENCH_NUMPY_ONLY=1: only the side-by-side runs against the numpy script (section 5b); BENCH_AUDIT_ONLY=1: only the audit (5, 5b). */
const numpyOnly = process.env.BENCH_NUMPY_ONLY === '1';
const auditOnly = process.env.BENCH_AUDIT_ONLY === '1';
/** The least time of `reps` runs: on a shared machine the least-loaded run is the closest to the cost itself. */
function timeMin(fn: () => void, reps: number): number {
  let best = Infinity;
  for (let i = 0; i < reps; i++) {
    const t0 = performance.now();
    fn();
    best = Math.min(best, performance.now() - t0);
  }
  return best;
}
console.log(`Baryon Audit benchmarks — ${new Date().toISOString().slice(0, 10)}, ${os.cpus().length} cores (${os.cpus()[0]?.model ?? '?'}), Node ${process.version}\n`);

if (!numpyOnly && !auditOnly) {
// 1. σ(M) table
const power = makeLinearPower(PLANCK18, { kind: 'eh98' });
report('σ(M) table, 341 masses 1e2–1e19 Msun (EH98)', time(() => makeSigmaTable(power), 7), '≤ 50 ms');

// 2. n(>M, z) grids
const hm = makeHaloModel({ cosmology: PLANCK18, transfer: { kind: 'eh98' }, massFunction: 'sheth-tormen' });
const grid = (nm: number, nz: number): void => {
  for (let j = 0; j < nz; j++) {
    const s = hm.slice(6 + (14 * j) / nz);
    for (let i = 0; i < nm; i++) s.nAbove(10 ** (8 + (7 * i) / nm));
  }
};
const gSizes = [[50, 15], [100, 30], [200, 60]];
const gTimes = gSizes.map(([a, b]) => time(() => grid(a, b), 7));
gSizes.forEach(([a, b], i) => report(`n(>M, z) grid ${a} masses × ${b} redshifts`, gTimes[i], a === 200 ? '≤ 20 ms' : '—'));
console.log(`   cost ∝ (cells)^${slope(gSizes.map(([a, b]) => a * b), gTimes).toFixed(2)}`);

// 3. background evaluations
const bg = makeBackground(PLANCK18);
const bgRun = (n: number): void => {
  let s = 0;
  for (let i = 0; i < n; i++) s += bg.comovingDistanceMpc(0.01 + (20 * i) / n) + bg.ageGyr((20 * i) / n);
  if (!Number.isFinite(s)) throw new Error('bad');
};
const bSizes = [1e4, 3e4, 1e5];
const bTimes = bSizes.map((n) => time(() => bgRun(n / 2), 5));
bSizes.forEach((n, i) => report(`${n.toExponential(0)} background evaluations (D_C and age)`, bTimes[i], '—'));
console.log(`   cost ∝ N^${slope(bSizes, bTimes).toFixed(2)}`);

// 3b. the batch of luminosity distances side by side with astropy (same redshifts, same parameters)
{
  const n = 100000;
  const bgA = makeBackground({ ...PLANCK18, h0: 67.66, omegaM: 0.3111, omegaB: 0.048975, omegaK: 0, tcmbK: 2.7255, nEff: 3.046, w0: -1, wa: 0 });
  const zs = Float64Array.from({ length: n }, (_, i) => 0.01 + (20 * i) / n);
  const out = new Float64Array(n);
  const ratios: number[] = [];
  let astropyVersion = '';
  for (let r = 0; r < 3; r++) {
    const py = spawnSync('/usr/bin/python3', ['test/bench/astropy_dl.py', String(n), '3'], { encoding: 'utf8' });
    if (py.status !== 0) {
      console.log(`   astropy timing failed (python3-astropy installed?): ${py.stderr.slice(0, 300)}`);
      break;
    }
    const a = JSON.parse(py.stdout);
    astropyVersion = a.astropy;
    const ms = time(() => bgA.luminosityDistancesMpc(zs, out), 5);
    ratios.push((a.seconds * 1000) / ms);
    console.log(`   run ${r + 1}: astropy ${a.astropy} ${(a.seconds * 1000).toFixed(1)} ms, tool batch ${ms.toFixed(2)} ms → ${ratios[r].toFixed(0)}×`);
  }
  let worst = 0;
  for (let i = 0; i < n; i++) worst = Math.max(worst, Math.abs(out[i] / bgA.luminosityDistanceMpc(zs[i]) - 1));
  const perPoint = time(() => bgRun(n / 2), 3);
  console.log(`   batch vs per-point D_L: worst relative difference ${worst.toExponential(2)} over ${n} redshifts; per-point D_C + age for the same count: ${perPoint.toFixed(1)} ms`);
  if (ratios.length) {
    const name = `D_L of 1e5 redshifts: astropy ${astropyVersion} time / tool batch time`;
    rows.push([name, `${median(ratios).toFixed(0)}×`, '≥ 50×, ≤ 1e-9 rel.', `worst rel. ${worst.toExponential(1)}; median of ${ratios.length}`]);
    console.log(`${name}: ${median(ratios).toFixed(0)}×   target ≥ 50×`);
  }
}

// 4. population tables and one mass estimate
const sfhs = ['burst', 'constant', 'exp-declining:100', 'exp-rising:100'].map(parseSfh);
const imfs = ['salpeter', 'kroupa', 'chabrier', 'top-heavy-flat', 'top-heavy-cmb'];
let cache = makePopulationCache();
report('population tables, 5 IMFs × 4 SFHs × 80 ages × 20 λ (cold)', time(() => {
  cache = makePopulationCache();
  for (const i of imfs) for (const s of sfhs) cache.table(i, 10, s);
}, 3), '≤ 200 ms');
report('population tables at the target size, 5 IMFs × 4 SFHs × 100 ages × 24 λ (cold)', time(() => {
  const c2 = makePopulationCache();
  for (const i of imfs) for (const s of sfhs) makeMassToLightTable(c2.population(i, 10), s, 100, 24);
}, 3), '≤ 200 ms');
const t = cache.table('salpeter', 10, sfhs[1]);
const nEst = 1e6;
const tEst = time(() => {
  let s = 0;
  for (let i = 0; i < nEst; i++) s += t.logMassToLight(1 + (i % 500), 0.15 + (i % 7) * 0.01);
  if (!Number.isFinite(s)) throw new Error('bad');
}, 5);
report('one mass estimate from the tables (M/L lookup)', tEst / nEst, '≤ 5 µs');
report('one full mass estimate (61 ages, median)', time(() => estimateMass(cache, 'chabrier', sfhs[1], { kind: 'absolute-uv', muv: -21 }, { kind: 'none' }, 10, bg), 50), '—');
}
if (!numpyOnly) {

// 5. the audit: galaxies × draws × 4 IMFs (fixed draws: the scaling of the Monte Carlo itself)
const choices: AuditChoices = { ...benchChoices, fixedDraws: true };
runAudit(sample(40), { ...choices, draws: 100 }); // set-up (halo model, ceilings, spread, tables) outside the clock
const aSizes = [50, 100, 200];
const aTimes = aSizes.map((n) => timeMin(() => runAudit(sample(n), choices), 3));
aSizes.forEach((n, i) => report(`audit (in process): ${n} galaxies × 20000 draws × 4 IMFs, fixed draws (least of 3)`, aTimes[i], '—'));
const perGal = (aTimes[2] - aTimes[0]) / (aSizes[2] - aSizes[0]);
console.log(`   cost ∝ N^${slope(aSizes, aTimes).toFixed(2)}; marginal ${perGal.toFixed(1)} ms per galaxy`);
const adTimes = aSizes.map((n) => timeMin(() => runAudit(sample(n), benchChoices), 3));
aSizes.forEach((n, i) => report(`audit (in process): ${n} galaxies, default (adaptive, 20000 draws at most) (least of 3)`, adTimes[i], '—'));
console.log(`   cost ∝ N^${slope(aSizes, adTimes).toFixed(2)}; marginal ${((adTimes[2] - adTimes[0]) / (aSizes[2] - aSizes[0])).toFixed(1)} ms per galaxy`);
// cost against the number of draws (40 galaxies)
{
  const dSizes = [5000, 10000, 20000, 40000];
  const dTimes = dSizes.map((dr) => timeMin(() => runAudit(sample(40), { ...choices, draws: dr }), 3));
  dSizes.forEach((dr, i) => report(`audit (in process): 40 galaxies × ${dr} draws × 4 IMFs, fixed draws (least of 3)`, dTimes[i], '—'));
  const perK = (dTimes[3] - dTimes[0]) / 40 / ((dSizes[3] - dSizes[0]) / 1000);
  console.log(`   cost ∝ draws^${slope(dSizes, dTimes).toFixed(2)}; per galaxy ${perK.toFixed(2)} ms per 1000 draws + ${(dTimes[0] / 40 - 5 * perK).toFixed(1)} ms that does not grow with the draws`);
  // memory per galaxy: the heap a finished audit keeps per galaxy (its record), and the work vectors,
  // which are reused from galaxy to galaxy and do not grow with the sample
  const g = globalThis as { gc?: () => void };
  g.gc?.();
  const h0 = process.memoryUsage().heapUsed;
  const kept = runAudit(sample(400), choices);
  g.gc?.();
  const h1 = process.memoryUsage().heapUsed;
  const perGalKb = (h1 - h0) / 1024 / kept.galaxies.length;
  console.log(`   heap kept per galaxy (400 galaxies, results held${g.gc ? ', after gc' : ', no --expose-gc: upper bound'}): ${perGalKb.toFixed(1)} kB`);
  rows.push(['audit: heap kept per galaxy (results of 400 galaxies held)', `${perGalKb.toFixed(1)} kB`, '—', 'work vectors reused, ~4 MB at 20 000 draws']);
}
// The large-sample target, measured as a user runs it: the CLI on a 1000-row file (default --jobs: the cores).
if (!auditOnly) {
  const dir = mkdtempSync(join(tmpdir(), 'ba-bench-'));
  const file = join(dir, 'sample-1000.csv');
  writeFileSync(file, sample(1000));
  const t0 = performance.now();
  const cli = (extra: string[]): number => {
    const t0 = performance.now();
    const r = spawnSync(process.execPath, ['src/cli/launch.mjs', 'assess', file, '--area-arcmin2', '40', '--z-range', '7:11', '--imf', 'salpeter,chabrier,kroupa,top-heavy-flat', '--draws', '20000', '--format', 'csv', ...extra], { encoding: 'utf8', maxBuffer: 1 << 28 });
    if (r.status !== 0) console.log(`   CLI run failed: ${r.stderr}`);
    return performance.now() - t0;
  };
  const wallFixed = cli(['--fixed-draws']);
  const wallDefault = cli([]);
  rmSync(dir, { recursive: true, force: true });
  report('audit CLI: 1000 galaxies × 20000 draws × 4 IMFs, --fixed-draws (wall time, --jobs = cores)', wallFixed, '≤ 10 s');
  report('audit CLI: the same, default (adaptive, --draws 20000 at most)', wallDefault, '—');
}

}

// 5a. the adaptive verdicts near the thresholds, over many seeds: wherever the fixed run's own verdict is
// settled (P(class change) < 1e-3), the adaptive verdict must be the same; a galaxy whose fixed verdict is
// not settled should run to the maximum (the 18 invented masses of adaptive-draws.test.ts, ±0.04 dex
// around ε_ref and 1; BENCH_NEAR_SEEDS seeds, 60 by default)
if (!numpyOnly) {
  const seeds = Number(process.env.BENCH_NEAR_SEEDS ?? 60);
  const csv = nearThresholdSample(nearChoices());
  let compared = 0;
  let differ = 0;
  let unsettled = 0;
  let stoppedEarly = 0;
  let drawsAdaptive = 0;
  let galaxies = 0;
  for (let seed = 1; seed <= seeds; seed++) {
    const f = runAudit(csv, nearChoices({ seed, fixedDraws: true }));
    const a = runAudit(csv, nearChoices({ seed }));
    f.galaxies.forEach((g, i) => {
      const ag = a.galaxies[i];
      galaxies++;
      drawsAdaptive += ag.monte_carlo!.draws_made;
      const imfs = Object.entries(g.imf!);
      if (imfs.some(([, r]) => r.p_verdict_change >= P_CLASS_CHANGE_MAX)) {
        unsettled++;
        if (ag.monte_carlo!.stop !== 'maximum') stoppedEarly++;
      }
      for (const [imf, r] of imfs) {
        if (r.p_verdict_change >= P_CLASS_CHANGE_MAX) continue;
        compared++;
        if (ag.imf![imf].verdict !== r.verdict) differ++;
      }
    });
  }
  const name = `adaptive verdicts near the thresholds (${seeds} seeds × 18 invented galaxies × 2 IMFs, 20000 draws at most): verdicts that differ from a settled fixed-draw verdict`;
  rows.push([name, `${differ} of ${compared}`, '0', `${unsettled} galaxies unsettled in the fixed run, ${stoppedEarly} of them stopped before the maximum; ${(drawsAdaptive / galaxies).toFixed(0)} draws per galaxy`]);
  console.log(`${name}: ${differ} of ${compared}   target 0`);
  console.log(`   galaxies whose fixed-draw verdict is unsettled: ${unsettled}, of which ${stoppedEarly} stopped before the maximum; adaptive draws per galaxy: ${(drawsAdaptive / galaxies).toFixed(0)}`);
}

// 5b. side by side with a vectorised numpy script doing the same per-draw work (numpy_audit.py), one
// thread each, alternated and repeated: the machine is shared, so only the ratio of neighbours counts.
{
  const nRows = Number(process.env.BENCH_NUMPY_ROWS ?? 1000);
  const reps = Number(process.env.BENCH_NUMPY_REPS ?? 2);
  const dir = mkdtempSync(join(tmpdir(), 'ba-numpy-'));
  const inputs = join(dir, 'inputs.json');
  const outFile = join(dir, 'numpy.json');
  writeNumpyInputs(nRows, benchChoices.draws, inputs);
  const csv = sample(nRows);
  const env = { ...process.env, OPENBLAS_NUM_THREADS: '1', OMP_NUM_THREADS: '1', MKL_NUM_THREADS: '1' };
  const ratios: number[] = [];
  const ratiosAdaptive: number[] = [];
  // the tool also in a process of its own per mode, as `assess --jobs 1` runs it (own-process-audit.ts),
  // beside the runs in this process (after every benchmark above, the fixed run just before the adaptive one)
  const ownBundle = process.env.BENCH_OWN_PROCESS_BUNDLE;
  const ownRatios: number[] = [];
  const ownRatiosAdaptive: number[] = [];
  const ownMs = (mode: 'fixed' | 'adaptive'): number | undefined => {
    if (!ownBundle) return undefined;
    const r = spawnSync(process.execPath, [ownBundle, String(nRows), mode], { encoding: 'utf8' });
    if (r.status !== 0) {
      console.log(`   the audit in a process of its own failed: ${r.stderr.slice(0, 300)}`);
      return undefined;
    }
    return (JSON.parse(r.stdout.trim().split('\n').pop()!) as { ms: number }).ms;
  };
  const fixedChoices: AuditChoices = { ...benchChoices, fixedDraws: true };
  let tool: ReturnType<typeof runAudit> | undefined;
  let adaptive: ReturnType<typeof runAudit> | undefined;
  let np: { wall_s: number; numpy: string; galaxies: { imf: Record<string, Record<string, number>> }[] } | undefined;
  console.log(`   machine load (uptime): ${readFileSync('/proc/loadavg', 'utf8').trim()}`);
  for (let r = 0; r < reps; r++) {
    const py = spawnSync('/usr/bin/python3', ['test/bench/numpy_audit.py', inputs, outFile], { encoding: 'utf8', env });
    if (py.status !== 0) {
      console.log(`   numpy script failed (python3-numpy installed?): ${py.stderr.slice(0, 300)}`);
      break;
    }
    np = JSON.parse(readFileSync(outFile, 'utf8'));
    const t0 = performance.now();
    tool = runAudit(csv, fixedChoices);
    const ms = performance.now() - t0;
    const t1 = performance.now();
    adaptive = runAudit(csv, benchChoices);
    const msA = performance.now() - t1;
    ratios.push((np!.wall_s * 1000) / ms);
    ratiosAdaptive.push((np!.wall_s * 1000) / msA);
    console.log(`   run ${r + 1}: numpy ${np!.numpy} ${np!.wall_s.toFixed(2)} s; tool fixed draws ${(ms / 1000).toFixed(2)} s → ${ratios[r].toFixed(2)}×; tool default (adaptive) ${(msA / 1000).toFixed(2)} s → ${ratiosAdaptive[r].toFixed(2)}× (one thread each)`);
    const own = ownMs('fixed');
    const ownA = ownMs('adaptive');
    if (own !== undefined && ownA !== undefined) {
      ownRatios.push((np!.wall_s * 1000) / own);
      ownRatiosAdaptive.push((np!.wall_s * 1000) / ownA);
      console.log(`          the tool in a process of its own per mode: fixed draws ${(own / 1000).toFixed(2)} s → ${ownRatios[r].toFixed(2)}×; default (adaptive) ${(ownA / 1000).toFixed(2)} s → ${ownRatiosAdaptive[r].toFixed(2)}×`);
    }
  }
  console.log(`   machine load after (uptime): ${readFileSync('/proc/loadavg', 'utf8').trim()}`);
  if (adaptive) {
    const made = adaptive.galaxies.map((g) => g.monte_carlo?.draws_made ?? 0);
    const counts = new Map<number, number>();
    for (const m of made) counts.set(m, (counts.get(m) ?? 0) + 1);
    const worst = (f: (g: ReturnType<typeof runAudit>["galaxies"][number]) => number): number => Math.max(...adaptive!.galaxies.map(f));
    console.log(`   adaptive draws made: mean ${(made.reduce((a, b) => a + b, 0) / made.length).toFixed(0)} (${[...counts].sort((a, b) => a[0] - b[0]).map(([m, c]) => `${c} × ${m}`).join(', ')}); worst MC error log M* ${worst((g) => g.monte_carlo!.log_mstar_median_mc_error_dex).toFixed(4)} dex, log eps ${worst((g) => g.monte_carlo!.log_eps_required_median_mc_error_dex).toFixed(4)} dex; verdicts equal to fixed: ${adaptive.galaxies.filter((g, i) => g.verdict === tool!.galaxies[i].verdict).length}/${made.length}`);
  }
  rmSync(dir, { recursive: true, force: true });
  if (tool && np) {
    // medians agree to Monte Carlo noise: the difference of two independent medians, in units of the
    // normal-theory error 1.2533 σ/√n (σ from p16–p84) of one; rms ≈ √2 when both are right.
    const zs: number[] = [];
    tool.galaxies.forEach((g, i) => {
      for (const imf of benchChoices.imfs) {
        const a = g.imf![imf];
        const w = (a.log_mstar_p84 - a.log_mstar_p16) / 2;
        zs.push((a.log_mstar_median - np!.galaxies[i].imf[imf].log_mstar_median) / ((1.2533 * w) / Math.sqrt(g.draws_used!)));
      }
    });
    const rms = Math.sqrt(zs.reduce((s, z) => s + z * z, 0) / zs.length);
    const mean = zs.reduce((s, z) => s + z, 0) / zs.length;
    console.log(`   medians of log M*, tool − numpy over ${zs.length} galaxy-IMF pairs: mean ${mean.toFixed(3)}, rms ${rms.toFixed(2)} in units of one median's normal-theory error (≈ √2 = 1.41 expected for independent draws)`);
    const name = `numpy time / tool time, ${nRows} galaxies × ${benchChoices.draws} draws × 4 IMFs, fixed draws, one thread`;
    rows.push([name, `${median(ratios).toFixed(2)}×`, '≥ 2×', `median of ${ratios.length} alternated runs`]);
    console.log(`${name}: ${median(ratios).toFixed(2)}×   target ≥ 2×`);
    const nameA = `numpy time / tool time, ${nRows} galaxies, default (adaptive, ${benchChoices.draws} draws at most), one thread`;
    rows.push([nameA, `${median(ratiosAdaptive).toFixed(2)}×`, '≥ 10×', `median of ${ratiosAdaptive.length} alternated runs`]);
    console.log(`${nameA}: ${median(ratiosAdaptive).toFixed(2)}×   target ≥ 10×`);
    if (ownRatios.length) {
      const own = (n: string): string => `${n}, the tool in a process of its own per mode (tables built before the clock)`;
      rows.push([own(name), `${median(ownRatios).toFixed(2)}×`, '≥ 2×', `median of ${ownRatios.length} alternated runs`]);
      rows.push([own(nameA), `${median(ownRatiosAdaptive).toFixed(2)}×`, '≥ 10×', `median of ${ownRatiosAdaptive.length} alternated runs`]);
      console.log(`${own(name)}: ${median(ownRatios).toFixed(2)}×   target ≥ 2×`);
      console.log(`${own(nameA)}: ${median(ownRatiosAdaptive).toFixed(2)}×   target ≥ 10×`);
    }
  }
}

if (!numpyOnly && !auditOnly) {
// 6. memory for a 100 000-row CSV
const big = sample(100000);
const before = process.memoryUsage().heapUsed;
const parsed = parseSample(big, () => true);
const after = process.memoryUsage().heapUsed;
const rss = process.memoryUsage().rss;
console.log(`parse a 100 000-row sample: ${parsed.rows.length} rows, heap +${((after - before) / 2 ** 20).toFixed(0)} MB, process RSS ${(rss / 2 ** 20).toFixed(0)} MB (target ≤ 500 MB)`);
rows.push(['100 000-row CSV parsed (process RSS)', `${(rss / 2 ** 20).toFixed(0)} MB`, '≤ 500 MB', '']);

// 7. peak RSS of the CLI's streamed audit, 1 000, 10 000 and 100 000 rows with 300-character notes
// (100 draws, one IMF: the memory, not the Monte Carlo, is measured; GNU time's %M is the peak RSS).
if (existsSync('/usr/bin/time')) {
  const dir = mkdtempSync(join(tmpdir(), 'ba-bench-'));
  const peak: number[] = [];
  for (const n of [1000, 10000, 100000]) {
    const file = join(dir, `notes-${n}.csv`);
    const lines = ['id,z,z_lo,z_hi,muv,mag_err,notes'];
    for (let i = 0; i < n; i++) lines.push(`N-${i},${(7 + (i % 400) / 100).toFixed(2)},${(6.8 + (i % 400) / 100).toFixed(2)},${(7.3 + (i % 400) / 100).toFixed(2)},-20.5,0.1,${'n'.repeat(300)}`);
    writeFileSync(file, lines.join('\n') + '\n');
    const r = spawnSync('/usr/bin/time', ['-f', '%M', process.execPath, 'src/cli/launch.mjs', 'assess', file, '--area-arcmin2', '40', '--z-range', '7:11', '--imf', 'salpeter', '--draws', '100', '--jobs', '1', '--format', 'json'], { encoding: 'utf8', stdio: ['ignore', 'ignore', 'pipe'] });
    peak.push(Number(r.stderr.trim().split('\n').pop()) / 1024);
  }
  // The live set, not V8's lazy peak: the 100 000-row audit run again with the JavaScript heap capped
  // at 160 MB (it aborts if the live objects ever need more).
  const capped = spawnSync(process.execPath, ['--max-old-space-size=160', 'src/cli/launch.mjs', 'assess', join(dir, 'notes-100000.csv'), '--area-arcmin2', '40', '--z-range', '7:11', '--imf', 'salpeter', '--draws', '100', '--jobs', '1', '--format', 'json'], { stdio: ['ignore', 'ignore', 'ignore'] });
  const fits = capped.status === 0 ? 'completes' : `fails (${capped.signal ?? capped.status})`;
  console.log(`the same 100 000-row audit with the heap capped at 160 MB: ${fits}`);
  rows.push(['audit CLI, 100 000 rows, JavaScript heap capped at 160 MB (`--max-old-space-size=160`)', fits, 'completes', 'the live set stays within 160 MB']);
  rmSync(dir, { recursive: true, force: true });
  // Per row: the growth from 10 000 to 100 000 rows; the file itself is ~335 bytes a row.
  const perRowKb = ((peak[2] - peak[1]) * 1024) / 90000;
  console.log(`streamed audit, peak RSS: 1 000 rows ${peak[0].toFixed(0)} MB, 10 000 rows ${peak[1].toFixed(0)} MB, 100 000 rows ${peak[2].toFixed(0)} MB (${perRowKb.toFixed(2)} kB a row beyond 10 000)`);
  rows.push(['audit CLI, 100 000 rows with 300-char notes, peak RSS (--jobs 1)', `${peak[2].toFixed(0)} MB`, '—', `1 000 rows: ${peak[0].toFixed(0)} MB; 10 000 rows: ${peak[1].toFixed(0)} MB; ${perRowKb.toFixed(2)} kB a row`]);
}

}

console.log('\nMarkdown table:\n');
console.log('| benchmark | median | target | note |\n| --- | --- | --- | --- |');
for (const r of rows) console.log(`| ${r.join(' | ')} |`);

/**
 * Benchmarks of the numeric core, the population tables and the audit. Prints medians, the
 * targets, and how cost grows with the work (log–log slope over three or more sizes).
 * Run with `npm run bench`. Nothing here is a test: no thresholds fail the run.
 */
import os, { tmpdir } from 'node:os';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { spawnSync } from 'node:child_process';
import { PLANCK18, makeBackground } from '../../src/core/cosmology/index.js';
import { makeHaloModel } from '../../src/core/halos/index.js';
import { makeLinearPower, makeSigmaTable } from '../../src/core/power/index.js';
import { estimateMass, makeMassToLightTable, makePopulationCache, parseSfh } from '../../src/core/stars/index.js';
import { parseSample, runAudit, type AuditChoices } from '../../src/core/audit/index.js';

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[(s.length - 1) >> 1];
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

console.log(`Baryon Audit benchmarks — ${new Date().toISOString().slice(0, 10)}, ${os.cpus().length} cores (${os.cpus()[0]?.model ?? '?'}), Node ${process.version}\n`);

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

// 5. the audit: galaxies × draws × 4 IMFs
const choices: AuditChoices = {
  cosmology: PLANCK18, massFunction: 'sheth-tormen', transfer: { kind: 'eh98' }, deltaC: { kind: 'constant', value: 1.686 },
  imfs: ['salpeter', 'chabrier', 'kroupa', 'top-heavy-flat'], sfh: 'constant', metallicity: 0.02, epsRef: 0.3, quantile: 0.997,
  draws: 20000, seed: 1, sliceDz: 1, formationZ: 30, survey: { name: 'bench', areaArcmin2: 40, zMin: 7, zMax: 11 }, surveys: [], zBins: [],
};
const sample = (n: number): string => {
  const lines = ['id,z,z_lo,z_hi,muv,mag_err,beta'];
  for (let i = 0; i < n; i++) {
    const z = 7.2 + (3.6 * i) / n;
    lines.push(`B-${i},${z.toFixed(3)},${(z - 0.2).toFixed(3)},${(z + 0.25).toFixed(3)},${(-19 - (i % 30) / 10).toFixed(2)},0.1,-2.0`);
  }
  return lines.join('\n');
};
const aSizes = [10, 40, 160];
const aTimes = aSizes.map((n) => time(() => runAudit(sample(n), choices), 1));
aSizes.forEach((n, i) => report(`audit (in process): ${n} galaxies × 20000 draws × 4 IMFs`, aTimes[i], '—'));
const perGal = (aTimes[2] - aTimes[1]) / (aSizes[2] - aSizes[1]);
console.log(`   cost ∝ N^${slope(aSizes, aTimes).toFixed(2)} (set-up included); marginal ${perGal.toFixed(1)} ms per galaxy`);
// The large-sample target, measured as a user runs it: the CLI on a 1000-row file (default --jobs: the cores).
{
  const dir = mkdtempSync(join(tmpdir(), 'ba-bench-'));
  const file = join(dir, 'sample-1000.csv');
  writeFileSync(file, sample(1000));
  const t0 = performance.now();
  const r = spawnSync(process.execPath, ['src/cli/launch.mjs', 'assess', file, '--area-arcmin2', '40', '--z-range', '7:11', '--imf', 'salpeter,chabrier,kroupa,top-heavy-flat', '--draws', '20000', '--format', 'csv'], { encoding: 'utf8', maxBuffer: 1 << 28 });
  const wall = performance.now() - t0;
  rmSync(dir, { recursive: true, force: true });
  if (r.status !== 0) console.log(`   CLI run failed: ${r.stderr}`);
  report('audit CLI: 1000 galaxies × 20000 draws × 4 IMFs (wall time, --jobs = cores)', wall, '≤ 10 s');
}

// 6. memory for a 100 000-row CSV
const big = sample(100000);
const before = process.memoryUsage().heapUsed;
const parsed = parseSample(big, () => true);
const after = process.memoryUsage().heapUsed;
const rss = process.memoryUsage().rss;
console.log(`parse a 100 000-row sample: ${parsed.rows.length} rows, heap +${((after - before) / 2 ** 20).toFixed(0)} MB, process RSS ${(rss / 2 ** 20).toFixed(0)} MB (target ≤ 500 MB)`);
rows.push(['100 000-row CSV parsed (process RSS)', `${(rss / 2 ** 20).toFixed(0)} MB`, '≤ 500 MB', '']);

// 7. peak RSS of the CLI's streamed audit, 10 000 vs 100 000 rows with 300-character notes
// (100 draws, one IMF: the memory, not the Monte Carlo, is measured; GNU time's %M is the peak RSS).
if (existsSync('/usr/bin/time')) {
  const dir = mkdtempSync(join(tmpdir(), 'ba-bench-'));
  const peak: number[] = [];
  for (const n of [10000, 100000]) {
    const file = join(dir, `notes-${n}.csv`);
    const lines = ['id,z,z_lo,z_hi,muv,mag_err,notes'];
    for (let i = 0; i < n; i++) lines.push(`N-${i},${(7 + (i % 400) / 100).toFixed(2)},${(6.8 + (i % 400) / 100).toFixed(2)},${(7.3 + (i % 400) / 100).toFixed(2)},-20.5,0.1,${'n'.repeat(300)}`);
    writeFileSync(file, lines.join('\n') + '\n');
    const r = spawnSync('/usr/bin/time', ['-f', '%M', process.execPath, 'src/cli/launch.mjs', 'assess', file, '--area-arcmin2', '40', '--z-range', '7:11', '--imf', 'salpeter', '--draws', '100', '--jobs', '1', '--format', 'json'], { encoding: 'utf8', stdio: ['ignore', 'ignore', 'pipe'] });
    peak.push(Number(r.stderr.trim().split('\n').pop()) / 1024);
  }
  rmSync(dir, { recursive: true, force: true });
  console.log(`streamed audit, peak RSS: 10 000 rows ${peak[0].toFixed(0)} MB, 100 000 rows ${peak[1].toFixed(0)} MB (ratio ${(peak[1] / peak[0]).toFixed(1)} for 10× the rows)`);
  rows.push(['audit CLI, 100 000 rows with 300-char notes, peak RSS (--jobs 1)', `${peak[1].toFixed(0)} MB`, '—', `10 000 rows: ${peak[0].toFixed(0)} MB`]);
}

console.log('\nMarkdown table:\n');
console.log('| benchmark | median | target | note |\n| --- | --- | --- | --- |');
for (const r of rows) console.log(`| ${r.join(' | ')} |`);

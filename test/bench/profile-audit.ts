/**
 * In-process run of the audit on the benchmark sample, for profiling on one thread:
 *   node test/bench/profile.mjs [rows] [draws]   (bundles this file; add --cpu-prof via NODE_OPTIONS)
 * Prints the wall time of the audit (the halo model and tables are built once, before the clock).
 */
import { runAudit } from '../../src/core/audit/index.js';
import { benchChoices, sample } from './audit-sample.js';

const rows = Number(process.argv[2] ?? 1000);
const draws = Number(process.argv[3] ?? 20000);
const choices = { ...benchChoices, draws };
runAudit(sample(rows), { ...choices, draws: 100 }); // warm: halo model, ceilings and their spread, population tables
const t0 = performance.now();
const r = runAudit(sample(rows), choices);
const ms = performance.now() - t0;
const ok = r.galaxies.filter((g) => g.status === 'ok').length;
console.log(`audit ${rows} rows × ${draws} draws × ${choices.imfs.length} IMFs: ${(ms / 1000).toFixed(2)} s (${ok} ok)`);

/**
 * The benchmark sample's audit timed in a process of its own, as `assess --jobs 1` runs it (bench.ts,
 * section 5b, beside the numpy script, which also runs alone):
 *   node <bundle of this file> ROWS fixed|adaptive
 * The halo model, the population tables and the ceilings are built before the clock (a first run of
 * the same rows at 100 draws), as the numpy script reads its tables before its own clock. Prints the
 * audit's wall time in ms as JSON.
 */
import { runAudit } from '../../src/core/audit/index.js';
import { benchChoices, sample } from './audit-sample.js';

const rows = Number(process.argv[2] ?? 1000);
const fixed = process.argv[3] === 'fixed';
const choices = fixed ? { ...benchChoices, fixedDraws: true } : benchChoices;
const csv = sample(rows);
runAudit(csv, { ...choices, draws: 100 });
const t0 = performance.now();
runAudit(csv, choices);
console.log(JSON.stringify({ ms: performance.now() - t0 }));

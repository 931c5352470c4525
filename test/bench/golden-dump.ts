/**
 * Writes the full audit output of a fixed set of samples (the demo sample, the benchmark sample, a
 * sample of reported masses) as JSON, so two versions of the audit can be compared number by number:
 *   node test/bench/golden.mjs OUT.json [draws]
 */
import { writeFileSync } from 'node:fs';
import { runAudit, type AuditChoices } from '../../src/core/audit/index.js';
import { DEMO_SAMPLE_CSV, DEMO_SURVEY } from '../../src/demo/demo-sample.js';
import { benchChoices, sample } from './audit-sample.js';

const out = process.argv[2];
const draws = Number(process.argv[3] ?? 20000);
const extra = (process.argv[4] ?? '{}');
const ch: AuditChoices = { ...benchChoices, draws, ...JSON.parse(extra) };
const demo = runAudit(DEMO_SAMPLE_CSV, { ...ch, survey: DEMO_SURVEY });
const bench = runAudit(sample(60), ch);
const masses = ['id,z,z_lo,z_hi,log_mstar,log_mstar_err,imf_ref,z_alt,p_alt'];
for (let i = 0; i < 20; i++) masses.push(`R-${i},${(7 + i * 0.2).toFixed(2)},${(6.8 + i * 0.2).toFixed(2)},${(7.3 + i * 0.2).toFixed(2)},${(9.5 + (i % 7) * 0.25).toFixed(2)},0.15,salpeter,${i % 3 ? '' : (3 + i * 0.1).toFixed(2)},${i % 3 ? '' : 0.2}`);
const mass = runAudit(masses.join('\n'), ch);
writeFileSync(out, JSON.stringify({ demo: demo.galaxies, bench: bench.galaxies, mass: mass.galaxies }, null, 1));

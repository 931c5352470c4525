/**
 * In-process run of the audit on the benchmark sample, for profiling on one thread:
 *   node test/bench/profile.mjs [rows] [draws] [choices JSON]   (bundles this file)
 * Prints the wall and CPU time of the audit (the halo model and tables are built once, before the clock).
 * With PROFILE_OUT=file.cpuprofile the timed run alone is profiled (node:inspector), without the set-up.
 */
import { writeFileSync } from 'node:fs';
import { Session } from 'node:inspector/promises';
import { runAudit } from '../../src/core/audit/index.js';
import { benchChoices, sample } from './audit-sample.js';

const rows = Number(process.argv[2] ?? 1000);
const draws = Number(process.argv[3] ?? 20000);
const choices = { ...benchChoices, draws, ...JSON.parse(process.argv[4] ?? '{}') };
runAudit(sample(rows), { ...choices, draws: 100 }); // warm: halo model, ceilings and their spread, population tables
const out = process.env.PROFILE_OUT;
const session = out ? new Session() : undefined;
if (session) {
  session.connect();
  await session.post('Profiler.enable');
  await session.post('Profiler.start');
}
const t0 = performance.now();
const c0 = process.cpuUsage();
const r = runAudit(sample(rows), choices);
const ms = performance.now() - t0;
const cpu = process.cpuUsage(c0);
if (session) {
  const { profile } = await session.post('Profiler.stop');
  writeFileSync(out!, JSON.stringify(profile));
}
const ok = r.galaxies.filter((g) => g.status === 'ok').length;
const used = r.galaxies.reduce((s, g) => s + (g.draws_used ?? 0), 0);
console.log(`audit ${rows} rows × ${draws} draws × ${choices.imfs.length} IMFs: ${(ms / 1000).toFixed(2)} s, CPU ${((cpu.user + cpu.system) / 1e6).toFixed(2)} s (${ok} ok, ${(used / Math.max(ok, 1)).toFixed(0)} draws per galaxy)`);

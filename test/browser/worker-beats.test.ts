import { expect } from 'chai';
import * as Comlink from 'comlink';
import type { AuditApi } from '../../workers/audit.worker.js';
import { DEFAULT_CHOICES } from '../../src/ui/default-choices.js';

/**
 * The pool leader's finish() (sample level, figures, reports) runs without yielding; it beats between
 * its steps so that the page's liveness check hears a worker that is still working (built worker bundle).
 */
const workerUrl = new URL('../../public/audit.worker.js', import.meta.url);

/** Resolves once `count()` reaches `want` or `limitMs` has passed, then after one more 50 ms turn. */
async function beatsSettled(count: () => number, want: number, limitMs: number): Promise<void> {
  const t0 = performance.now();
  while (count() < want && performance.now() - t0 < limitMs) await new Promise((r) => setTimeout(r, 10));
  await new Promise((r) => setTimeout(r, 50));
}

describe('the pool leader while it finishes', () => {
  it('beats after each step of finish(), and the result is whole', async () => {
    const worker = new Worker(workerUrl, { type: 'module' });
    const failed = new Promise<never>((_, reject) => worker.addEventListener('error', (e) => reject(new Error(`worker error: ${e.message}`))));
    const api = Comlink.wrap<AuditApi>(worker);
    const lines = ['id,z,z_lo,z_hi,muv,mag_err'];
    for (let i = 0; i < 30; i++) lines.push(`B-${i},${(7.5 + i * 0.1).toFixed(2)},${(7.3 + i * 0.1).toFixed(2)},${(7.7 + i * 0.1).toFixed(2)},-21,0.1`);
    const req = { id: 7, csv: lines.join('\n'), choices: { ...DEFAULT_CHOICES, draws: 200, imfs: ['salpeter'] } };
    const kept = await Promise.race([api.runRows(req, { index: 0, of: 2 }, undefined, true), failed]);
    const other = await Promise.race([api.runRows(req, { index: 1, of: 2 }, undefined, false), failed]);
    expect(kept).to.equal(15);
    let beats = 0;
    const resp = await Promise.race([api.finish(req, [other as string], 0, Comlink.proxy(() => void beats++)), failed]);
    // The beats come on the proxy's own message port, the response on the worker's: the two ports keep no
    // order between them, so the last beats may arrive after finish() resolves. Wait for them (bounded),
    // then one more turn for any beat too many; the count itself stays exact.
    await beatsSettled(() => beats, 6, 2000);
    // One beat after preparing the audit, one per part from the other members, four in the response.
    expect(beats).to.equal(6);
    expect(resp.result!.galaxies).to.have.length(30);
    worker.terminate();
  });
});

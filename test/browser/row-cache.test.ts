import { expect } from 'chai';
import { AuditController, type ControllerState } from '../../src/ui/audit-controller.js';
import { DEFAULT_CHOICES } from '../../src/ui/default-choices.js';

/**
 * The worker keeps the results of rows it has audited, so that an edit re-audits one row. A row must
 * still depend on itself alone: a rejection for a repeated id depends on the other rows, so it is
 * never served from that store (built worker bundle, one worker kept across runs).
 */
const workerUrl = new URL('../../public/audit.worker.js', import.meta.url);

describe("the worker's store of audited rows", () => {
  it('a row rejected for repeating an id is accepted once the other row is renamed', async () => {
    let settle: ((s: ControllerState) => void) | undefined;
    const c = new AuditController(
      (s) => {
        if (s.status === 'done' || s.status === 'error') settle?.(s);
      },
      () => {
        const w = new Worker(workerUrl, { type: 'module' });
        w.addEventListener('error', (e) => settle?.({ status: 'error', message: `worker error: ${e.message}` } as ControllerState));
        return w;
      },
      1,
    );
    const run = (csv: string): Promise<ControllerState> =>
      new Promise((resolve) => {
        settle = resolve;
        void c.run(csv, { ...DEFAULT_CHOICES, draws: 200, imfs: ['salpeter'] });
      });
    const first = await run('id,z,muv\nR-1,9,-20\nR-1,9.5,-21\n');
    expect(first.status, (first as { message?: string }).message).to.equal('done');
    expect(first.response!.result!.galaxies.map((g) => g.status)).to.deep.equal(['ok', 'rejected']);
    const second = await run('id,z,muv\nR-0,9,-20\nR-1,9.5,-21\n');
    expect(second.status).to.equal('done');
    expect(second.response!.result!.galaxies.map((g) => g.status)).to.deep.equal(['ok', 'ok']);
    c.dispose();
  });
});

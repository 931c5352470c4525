import { expect } from 'chai';
import { AuditController, type ControllerState } from '../../src/ui/audit-controller.js';
import { DEFAULT_CHOICES } from '../../src/ui/default-choices.js';

/** The worker pool against the single worker: the same numbers, row for row (built worker bundle). */
const workerUrl = new URL('../../public/audit.worker.js', import.meta.url);

function audit(poolSize: number, csv: string): Promise<ControllerState> {
  return new Promise((resolve, reject) => {
    const c = new AuditController(
      (s) => {
        if (s.status === 'done') {
          c.dispose();
          resolve(s);
        } else if (s.status === 'error') {
          c.dispose();
          reject(new Error(s.message));
        }
      },
      () => new Worker(workerUrl, { type: 'module' }),
      poolSize,
    );
    void c.run(csv, { ...DEFAULT_CHOICES, draws: 400, imfs: ['salpeter', 'top-heavy-flat'] });
  });
}

describe('worker pool', () => {
  it('a 30-row sample on 2 workers gives exactly the single-worker result', async () => {
    const lines = ['id,z,z_lo,z_hi,muv,mag_err'];
    for (let i = 0; i < 30; i++) lines.push(`W-${i},${(7.3 + i * 0.1).toFixed(2)},${(7.1 + i * 0.1).toFixed(2)},${(7.5 + i * 0.1).toFixed(2)},-20.8,0.1`);
    lines.push('W-bad,abc,,,-20,');
    const csv = lines.join('\n');
    const one = await audit(1, csv);
    const two = await audit(2, csv);
    expect(two.response!.result!.galaxies).to.deep.equal(one.response!.result!.galaxies);
    expect(two.response!.result!.sample).to.deep.equal(one.response!.result!.sample);
    expect(two.response!.result!.galaxies.filter((g) => g.status === 'rejected').length).to.equal(1);
  });
});

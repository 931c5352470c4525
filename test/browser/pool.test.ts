import { expect } from 'chai';
import { AuditController, type ControllerState } from '../../src/ui/audit-controller.js';
import { DEFAULT_CHOICES } from '../../src/ui/default-choices.js';

/**
 * The worker pool against the single worker: the same numbers, row for row (built worker bundle), also
 * when the result is handed over in pages; and a pool worker that stops silently is found and replaced.
 */
const workerUrl = new URL('../../public/audit.worker.js', import.meta.url);
const make = (): Worker => new Worker(workerUrl, { type: 'module' });

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
      make,
      poolSize,
    );
    void c.run(csv, { ...DEFAULT_CHOICES, draws: 400, imfs: ['salpeter', 'top-heavy-flat'] });
  });
}

function sample(rows: number): string {
  const lines = ['id,z,z_lo,z_hi,muv,mag_err'];
  for (let i = 0; i < rows; i++) lines.push(`W-${i},${(7.3 + (i % 30) * 0.1).toFixed(2)},${(7.1 + (i % 30) * 0.1).toFixed(2)},${(7.5 + (i % 30) * 0.1).toFixed(2)},${(-20.8 + (i % 7) * 0.1).toFixed(1)},0.1`);
  return lines.join('\n');
}

describe('worker pool', () => {
  it('a 30-row sample on 2 workers gives exactly the single-worker result', async () => {
    const csv = `${sample(30)}\nW-bad,abc,,,-20,`;
    const one = await audit(1, csv);
    const two = await audit(2, csv);
    expect(two.response!.result!.galaxies).to.deep.equal(one.response!.result!.galaxies);
    expect(two.response!.result!.sample).to.deep.equal(one.response!.result!.sample);
    expect(two.response!.result!.galaxies.filter((g) => g.status === 'rejected').length).to.equal(1);
  });

  it('a 1201-row sample (handed over in pages) on 2 workers gives exactly the single-worker result, in row order', async () => {
    const csv = `${sample(1200)}\nW-bad,abc,,,-20,`;
    const one = await audit(1, csv);
    const two = await audit(2, csv);
    const g1 = one.response!.result!.galaxies;
    expect(g1.length).to.equal(1201);
    expect(g1.map((g) => g.row)).to.deep.equal(Array.from({ length: 1201 }, (_, i) => i + 1));
    expect(two.response!.result!.galaxies).to.deep.equal(g1);
    expect(two.response!.markdown).to.equal(one.response!.markdown);
    expect(two.response!.csv).to.equal(one.response!.csv);
  });

  it('a pool worker that stops silently mid-run is found by the liveness check; the pool is restarted and the run completes', async () => {
    const states: ControllerState[] = [];
    let stopped = false;
    const finished = new Promise<ControllerState>((resolve) => {
      const c = new AuditController(
        (s) => {
          states.push(s);
          if (!stopped && s.status === 'running' && s.done > 0) stopped = c.stopWorkerSilently('pool');
          if (s.status === 'done') {
            c.dispose();
            resolve(s);
          }
        },
        make,
        { poolSize: 2, livenessMs: 8000, progressEveryMs: 100 }, // above the audit's set-up (ceiling tables, the ceiling's cosmological spread), which sends no progress
      );
      void c.run(sample(600), { ...DEFAULT_CHOICES, draws: 400, imfs: ['salpeter', 'top-heavy-flat'] });
    });
    const end = await finished;
    expect(stopped).to.equal(true);
    const failure = states.find((s) => s.status === 'error');
    expect(failure?.message).to.match(/a pool worker stopped answering .*restarted/);
    expect(end.restarts).to.equal(1);
    expect(end.response!.result!.galaxies.length).to.equal(600);
  });
});

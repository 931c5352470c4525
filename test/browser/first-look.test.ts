import { expect } from 'chai';
import { AuditController, type ControllerState } from '../../src/ui/audit-controller.js';
import '../../src/ui/results-table.js';
import type { ResultsTable } from '../../src/ui/results-table.js';
import { DEFAULT_CHOICES } from '../../src/ui/default-choices.js';
import { DEMO_SAMPLE_CSV } from '../../src/demo/demo-sample.js';

/**
 * A small sample's first look: with a second worker ready, the page gets the audit without what it would
 * take for the galaxies in tension (figures first), then the whole audit. What finally shows must be the
 * single worker's whole audit, row for row, with the same reports (built worker bundle, public/audit.worker.js).
 */
const workerUrl = new URL('../../public/audit.worker.js', import.meta.url);
const choices = { ...DEFAULT_CHOICES, draws: 600, imfs: ['salpeter', 'top-heavy-flat'] };

/** What the page posted to each worker (Comlink calls by method name) and each answer's call id, in order. */
type Logged = { w: number; kind: 'call' | 'answer'; name?: string; msgId?: string };

/** A controller on the built worker; with `log`, every call to a worker and every answer is logged there. */
function controller(poolSize: number, states: ControllerState[], log?: Logged[]): AuditController {
  let made = 0;
  return new AuditController(
    (s) => states.push(s),
    () => {
      const w = new Worker(workerUrl, { type: 'module' });
      w.addEventListener('error', (e) => states.push({ status: 'error', message: `worker error: ${e.message}` } as ControllerState));
      if (log) {
        const k = made++;
        w.addEventListener('message', (e) => log.push({ w: k, kind: 'answer', msgId: (e.data as { id?: string })?.id }));
        const post = w.postMessage.bind(w) as (m: unknown, t?: Transferable[]) => void;
        w.postMessage = ((m: { id?: string; type?: string; path?: string[] }, t?: Transferable[]) => {
          if (m?.type === 'APPLY') log.push({ w: k, kind: 'call', name: m.path?.join('.'), msgId: m.id });
          post(m, t);
        }) as Worker['postMessage'];
      }
      return w;
    },
    poolSize,
  );
}

/** Waits until `ok` holds for the last state (or one is an error). */
async function until(states: ControllerState[], ok: (s: ControllerState) => boolean, what: string): Promise<ControllerState> {
  const t0 = performance.now();
  for (;;) {
    const s = states.at(-1);
    if (s?.status === 'error') throw new Error(`${what}: ${s.message}`);
    if (s && ok(s)) return s;
    if (performance.now() - t0 > 60000) throw new Error(`${what}: not within 60 s`);
    await new Promise((r) => setTimeout(r, 20));
  }
}

const whole = (s: ControllerState): boolean => s.status === 'done' && !s.settling;

describe('first look, then the whole audit', () => {
  it("shows a first look without the reconciliation, then exactly the single worker's whole audit", async () => {
    const one: ControllerState[] = [];
    const single = controller(1, one);
    void single.run(DEMO_SAMPLE_CSV, { ...choices, seed: 7 });
    const ref = (await until(one, whole, 'the single worker')).response!;
    single.dispose();

    const states: ControllerState[] = [];
    const c = controller(2, states);
    void c.run(DEMO_SAMPLE_CSV, choices);
    const firstRun = await until(states, whole, 'the first run');
    expect(firstRun.response!.reconcileLeftOut, 'a first run has no second worker ready: whole at once').to.equal(undefined);
    const t0 = performance.now();
    while (!c.firstLooks && performance.now() - t0 < 60000) await new Promise((r) => setTimeout(r, 50));
    expect(c.firstLooks, 'the second worker is ready after the first whole audit').to.equal(true);

    const from = states.length;
    void c.run(DEMO_SAMPLE_CSV, { ...choices, seed: 7 });
    const last = await until(states, (s) => whole(s) && s.response!.result!.record.choices.seed === 7, 'the edit');
    const look = states.slice(from).find((s) => s.status === 'done' && s.settling);
    expect(look, 'a first look was shown before the whole audit').to.not.equal(undefined);
    const lr = look!.response!;
    const inTension = ref.result!.galaxies.filter((g) => g.status === 'ok' && g.verdict !== 'within budget');
    expect(inTension.length).to.be.greaterThan(0);
    expect(lr.reconcileLeftOut).to.equal(inTension.length);
    expect(lr.markdown).to.equal(undefined);
    expect(lr.csv).to.equal(undefined);
    for (const g of lr.result!.galaxies) if (g.status === 'ok') expect(g.reconcile).to.deep.equal([]);
    // everything but the reconciliation is already the whole audit's
    expect(lr.result!.galaxies.map((g) => ({ ...g, reconcile: [] }))).to.deep.equal(ref.result!.galaxies.map((g) => ({ ...g, reconcile: [] })));

    const fin = last.response!;
    expect(fin.reconcileLeftOut).to.equal(undefined);
    expect(fin.result!.galaxies).to.deep.equal(ref.result!.galaxies);
    expect(fin.result!.sample).to.deep.equal(ref.result!.sample);
    expect(fin.markdown).to.equal(ref.markdown);
    expect(fin.csv).to.equal(ref.csv);
    expect(fin.points, "the figures' data stay those of the first look").to.equal(lr.points);

    // the table says the reconciliation is on its way, not that there is nothing to reconcile
    document.querySelectorAll('results-table').forEach((e) => e.remove());
    const el = document.createElement('results-table') as ResultsTable;
    el.result = lr.result;
    el.reconcileLeftOut = 'coming';
    document.body.append(el);
    await el.updateComplete;
    const row = el.shadowRoot!.querySelector(`tr[data-id="${inTension[0].id}"]`)!;
    (row.querySelector('button.tog') as HTMLButtonElement).click();
    await el.updateComplete;
    expect(el.shadowRoot!.querySelector('tr.detail p.rc')!.textContent).to.contain('being worked out');
    el.reconcileLeftOut = 'stopped';
    await el.updateComplete;
    expect(el.shadowRoot!.querySelector('tr.detail p.rc')!.textContent).to.contain('Run again');
    el.remove();
    c.dispose();
  });
  it('starts the whole audit once the first look is in, not at all when the first look left nothing out, and at once when the main worker is busy', async () => {
    const states: ControllerState[] = [];
    const log: Logged[] = [];
    const c = controller(2, states, log);
    void c.run(DEMO_SAMPLE_CSV, choices);
    await until(states, whole, 'the first run');
    const t0 = performance.now();
    while (!c.firstLooks && performance.now() - t0 < 60000) await new Promise((r) => setTimeout(r, 50));
    expect(c.firstLooks).to.equal(true);
    /** The index in the log of worker w's first `run` call from `from` on, and of its answer. */
    const runCall = (w: number, from: number) => log.findIndex((e, i) => i >= from && e.w === w && e.kind === 'call' && e.name === 'run');
    const answerTo = (w: number, call: number) => log.findIndex((e, i) => i > call && e.w === w && e.kind === 'answer' && e.msgId === log[call].msgId);

    // an edit: the first look on the main worker (0), the whole audit on the second (1) after its answer
    let from = log.length;
    void c.run(DEMO_SAMPLE_CSV, { ...choices, seed: 7 });
    await until(states, (s) => whole(s) && s.response!.result!.record.choices.seed === 7, 'the edit');
    const look = runCall(0, from);
    expect(look).to.be.greaterThan(-1);
    const wholeCall = runCall(1, from);
    expect(wholeCall, 'the second worker audits the whole sample').to.be.greaterThan(-1);
    expect(wholeCall, "the whole audit is asked for after the first look's answer").to.be.greaterThan(answerTo(0, look));

    // a sample with no galaxy in tension (invented): the first look is already whole, the second worker is not asked
    from = log.length;
    void c.run('id,z,muv\nQUIET-1,7.2,-17.5', { ...choices, seed: 8 });
    const quiet = await until(states, (s) => whole(s) && s.response!.result!.record.choices.seed === 8, 'the quiet sample');
    expect(quiet.response!.reconcileLeftOut ?? 0).to.equal(0);
    expect(quiet.response!.markdown).to.be.a('string');
    expect(runCall(1, from), 'no whole audit for a first look that left nothing out').to.equal(-1);
    expect(log.slice(from).some((e) => e.kind === 'call' && e.name === 'cancel'), 'nothing to cancel: only the first look ran').to.equal(false);

    // the main worker still owes an answer (a map): the whole audit is asked for at once, before the first look's
    from = log.length;
    const map = c.map(DEMO_SAMPLE_CSV, choices, 0);
    void c.run(DEMO_SAMPLE_CSV, { ...choices, seed: 9 });
    const busyWhole = runCall(1, from);
    expect(busyWhole, 'asked for at once').to.be.greaterThan(-1);
    await map;
    const fin = await until(states, (s) => whole(s) && s.response!.result!.record.choices.seed === 9, 'the edit behind a map');
    expect(fin.response!.reconcileLeftOut).to.equal(undefined);
    const mapCall = log.findIndex((e, i) => i >= from && e.w === 0 && e.kind === 'call' && e.name === 'map');
    expect(answerTo(0, mapCall)).to.be.greaterThan(-1);
    expect(busyWhole, "asked for before the main worker's answer to the map, so before its first look's too").to.be.lessThan(answerTo(0, mapCall));
    c.dispose();
  });
});

import * as Comlink from 'comlink';
import type { AuditChoices } from '../core/audit/choices.js';
import { POOL_MIN_ROWS, threadsFor } from '../core/audit/row-dealing.js';
import type { GalaxyRow } from '../core/audit/run-audit.js';
import type { DisputedMap } from '../core/audit/disputed-map.js';
import type { ParamCovariance } from '../core/cosmology/parameter-covariance.js';
import type { AuditApi, AuditResponse, ExplorerRequest, ExplorerResponse } from '../../workers/audit.worker.js';

export interface ControllerState {
  readonly status: 'idle' | 'running' | 'done' | 'error';
  /** Rows audited so far, of `total` (0 while the sample is being read). */
  readonly done: number;
  readonly total: number;
  /** Rows per second since the first row started, once it can be told. */
  readonly rowsPerSecond?: number;
  /** Estimated seconds until every row is audited, from `rowsPerSecond`. */
  readonly secondsLeft?: number;
  readonly response?: AuditResponse;
  /**
   * The response on show is a first look (`response.reconcileLeftOut` > 0) and the whole audit, with what it
   * would take for the galaxies in tension and the reports, is on its way.
   */
  readonly settling?: boolean;
  /** What went wrong, in words for the page (input problem or worker failure). */
  readonly message?: string;
  readonly restarts: number;
}

export interface ControllerOptions {
  /** Workers for samples of POOL_MIN_ROWS rows or more (default: the machine's cores, at most 4). */
  readonly poolSize?: number;
  /** A worker that owes an answer and has said nothing for this long is taken for dead [ms]. */
  readonly livenessMs?: number;
  /** Delay before the first restart after a failure; it doubles with every failure in a row [ms]. */
  readonly restartBaseMs?: number;
  /** Failures in a row (without a completed audit between them) after which no restart is tried. */
  readonly maxTries?: number;
  /** The page is told about progress at most this often [ms]. */
  readonly progressEveryMs?: number;
}

type Api = Comlink.Remote<AuditApi>;

/** One worker, what it owes and when it was last heard from. */
interface Slot {
  readonly worker: Worker;
  readonly api: Api;
  readonly role: string;
  pending: number;
  lastHeard: number;
  /** Settles every call still owed by this worker once it is given up. */
  readonly lost: Promise<never>;
  readonly lose: (e: Error) => void;
}

/** Lines of a text (without splitting it). */
function lineCount(text: string): number {
  let n = 0;
  for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) n++;
  return text.endsWith('\n') || !text.length ? n : n + 1;
}

/** Rows per page when a large result is fetched from the worker (each page is one short message). */
const PAGE_ROWS = 500;

/**
 * The only UI code that knows about the workers. The latest request wins: a new run cancels the one in
 * flight and stale answers are dropped. Samples of POOL_MIN_ROWS rows or more are dealt over a pool
 * (core/audit/row-dealing.ts, shared with the command line). Progress (rows, rows per second, time
 * left) reaches the page at most every progressEveryMs. A worker that dies (error event, unreadable
 * message, or silence: nothing heard for livenessMs while it owes an answer) is replaced and the last
 * inputs that completed are run again, and the page is told. Restarts back off exponentially and stop
 * after maxTries failures in a row (a worker script that cannot load), and the page is told that too.
 */
export class AuditController {
  private slots: Slot[] = [];
  private seq = 0;
  private lastGood?: { csv: string; choices: AuditChoices };
  private inFlight?: { csv: string; choices: AuditChoices };
  private failures = 0;
  private gaveUp = false;
  /** The second worker has built its tables (see readySecond): small samples then get a first look. */
  private secondReady = false;
  private readying = false;
  private disposed = false;
  private restartTimer?: ReturnType<typeof setTimeout>;
  private watchdog?: ReturnType<typeof setInterval>;
  private progress?: { id: number; start: number; done: number[]; total: number; lastEmit: number };
  private readonly poolSize: number;
  private readonly restartBaseMs: number;
  private readonly maxTries: number;
  private readonly progressEveryMs: number;
  /** See ControllerOptions.livenessMs; the recovery tests shorten it. */
  livenessMs: number;
  state: ControllerState = { status: 'idle', done: 0, total: 0, restarts: 0 };

  /**
   * @param options a number is the pool size (see ControllerOptions.poolSize).
   */
  constructor(
    private readonly onChange: (s: ControllerState) => void,
    private makeWorker: () => Worker = () => new Worker(new URL('./audit.worker.js', import.meta.url), { type: 'module' }),
    options: number | ControllerOptions = {},
  ) {
    const o: ControllerOptions = typeof options === 'number' ? { poolSize: options } : options;
    this.poolSize = o.poolSize ?? Math.max(1, Math.min(4, globalThis.navigator?.hardwareConcurrency ?? 1));
    this.livenessMs = o.livenessMs ?? 15000;
    this.restartBaseMs = o.restartBaseMs ?? 250;
    this.maxTries = o.maxTries ?? 4;
    this.progressEveryMs = o.progressEveryMs ?? 500;
    this.start();
  }

  static readonly POOL_MIN_ROWS = POOL_MIN_ROWS;

  /** A new worker whose failure (error event or unreadable message) restarts the whole set. */
  private spawn(role: string): Slot {
    const worker = this.makeWorker();
    let lose!: (e: Error) => void;
    const lost = new Promise<never>((_, reject) => (lose = reject));
    lost.catch(() => undefined);
    const slot: Slot = { worker, api: Comlink.wrap<AuditApi>(worker), role, pending: 0, lastHeard: performance.now(), lost, lose };
    const mine = (): boolean => this.slots.includes(slot);
    worker.addEventListener('error', (e) => {
      e.preventDefault();
      if (mine()) this.crashed(`${role} failed (${(e as ErrorEvent).message || 'its script could not be loaded or run'})`);
    });
    worker.addEventListener('messageerror', () => mine() && this.crashed(`${role} sent a message that could not be read`));
    return slot;
  }

  private get main(): Slot {
    return this.slots[0];
  }

  private start(): void {
    this.slots = [this.spawn('the computation worker')];
    this.secondReady = false;
    this.readying = false;
  }

  /** Whether small samples get a first look beside the whole audit (a second worker is ready). */
  get firstLooks(): boolean {
    return this.secondReady;
  }

  /**
   * After a whole audit is on show, a second worker builds its tables by auditing the same sample (its
   * answer is not used), so that later runs of small samples get a first look while it does the whole.
   */
  private readySecond(req: { id: number; csv: string; choices: AuditChoices }): void {
    if (this.poolSize < 2 || this.secondReady || this.readying) return;
    this.readying = true;
    const slot = this.pool(2)[1];
    this.call(slot, (api) => api.warm(req)).then(
      (r) => {
        if (this.slots[1] !== slot) return; // replaced meanwhile: start() reset both flags
        this.secondReady = r === 'done';
        this.readying = false;
      },
      () => undefined, // a lost worker restarts the set (crashed), which starts over
    );
  }

  /** The main worker and k − 1 pool helpers. */
  private pool(k: number): Slot[] {
    while (this.slots.length < k) this.slots.push(this.spawn('a pool worker'));
    return this.slots.slice(0, k);
  }

  /** A call to a worker: counted as owed until answered (for the liveness check), settled if the worker is lost. */
  private call<T>(slot: Slot, f: (api: Api) => Promise<T>): Promise<T> {
    slot.pending++;
    slot.lastHeard = performance.now();
    this.watch();
    const heard = (): void => {
      slot.pending--;
      slot.lastHeard = performance.now();
    };
    return Promise.race([f(slot.api).finally(heard), slot.lost]);
  }

  /**
   * Checks, while any worker owes an answer, that every such worker has been heard from recently.
   * Time in which the page's own main thread was blocked (a late check) is not counted as silence:
   * the workers' messages were waiting behind it.
   */
  private watch(): void {
    if (this.watchdog !== undefined) return;
    const every = Math.max(50, Math.min(1000, this.livenessMs / 4));
    let lastCheck = performance.now();
    this.watchdog = setInterval(() => {
      const now = performance.now();
      const stalled = now - lastCheck - every;
      lastCheck = now;
      const owing = this.slots.filter((s) => s.pending > 0);
      if (!owing.length) {
        clearInterval(this.watchdog);
        this.watchdog = undefined;
        return;
      }
      if (stalled > every) {
        for (const s of owing) s.lastHeard += stalled;
        return; // judge at the next check, once the waiting messages have been read
      }
      const silent = owing.find((s) => now - s.lastHeard > this.livenessMs);
      if (silent) this.crashed(`${silent.role} stopped answering (nothing heard for ${((now - silent.lastHeard) / 1000).toFixed(1)} s)`);
    }, every);
  }

  private set(s: Partial<ControllerState>): void {
    this.state = { ...this.state, ...s };
    this.onChange(this.state);
  }

  private crashed(why: string): void {
    if (this.disposed) return;
    for (const s of this.slots) {
      s.worker.terminate();
      s.lose(new Error(why));
    }
    this.slots = [];
    this.seq++;
    this.progress = undefined;
    this.failures++;
    const redo = this.lastGood ?? this.inFlight;
    const restarts = this.state.restarts + 1;
    if (this.failures >= this.maxTries) {
      this.gaveUp = true;
      this.set({ status: 'error', restarts, message: `${why}. It failed ${this.failures} times in a row, so it is no longer restarted; reload the page to try again.` });
      return;
    }
    this.set({ status: 'error', restarts, message: `${why}; it was restarted${redo ? ' and the last good inputs were run again' : ''}.` });
    clearTimeout(this.restartTimer);
    this.restartTimer = setTimeout(() => {
      this.restartTimer = undefined;
      if (this.disposed || this.slots.length) return;
      this.start();
      if (redo) void this.run(redo.csv, redo.choices, true);
    }, this.restartBaseMs * 2 ** (this.failures - 1));
  }

  /** Workers for a new request: a pending restart happens now; after giving up, one fresh try. */
  private ensureStarted(): void {
    if (this.slots.length) return;
    clearTimeout(this.restartTimer);
    this.restartTimer = undefined;
    if (this.gaveUp) {
      this.gaveUp = false;
      this.failures = 0;
    }
    this.start();
  }

  /** Progress from worker `w` of request `id` (its rows done, the sample's rows); the page hears of it at most every progressEveryMs. */
  private onProgress(id: number, slot: Slot, w: number, done: number, total: number): void {
    slot.lastHeard = performance.now();
    const p = this.progress;
    if (!p || p.id !== id || id !== this.seq) return;
    p.done[w] = done;
    p.total = total;
    const now = performance.now();
    if (now - p.lastEmit < this.progressEveryMs) return;
    p.lastEmit = now;
    const sum = p.done.reduce((a, b) => a + b, 0);
    const seconds = (now - p.start) / 1000;
    const rate = sum > 0 && seconds > 0.2 ? sum / seconds : undefined;
    this.set({ done: sum, total: p.total, rowsPerSecond: rate, secondsLeft: rate ? Math.max(0, p.total - sum) / rate : undefined });
  }

  private track(id: number, workers: number): void {
    const now = performance.now();
    this.progress = { id, start: now, done: new Array(workers).fill(0), total: 0, lastEmit: now };
  }

  /** Runs an audit; resolves when this request is answered, superseded or failed. */
  async run(csv: string, choices: AuditChoices, keepMessage = false): Promise<void> {
    const id = ++this.seq;
    this.ensureStarted();
    if (this.state.status === 'running' || this.state.settling) for (const s of this.slots) void s.api.cancel();
    this.inFlight = { csv, choices };
    this.set({ status: 'running', settling: false, done: 0, total: 0, rowsPerSecond: undefined, secondsLeft: undefined, ...(keepMessage ? {} : { message: undefined }) });
    const t0 = performance.now();
    const main = this.main;
    try {
      // Threads from the line count (an upper bound on the rows: nothing is parsed here); each worker
      // parses the sample and takes its own share, so the pool starts without a round trip.
      const k = this.poolSize > 1 ? threadsFor(lineCount(csv) - 1, this.poolSize) : 1;
      const req = { id, csv, choices };
      let resp: AuditResponse | undefined;
      let whole: Promise<AuditResponse> | undefined;
      /** Whether the first look and the whole audit were asked for at once (then the later answer may be unneeded). */
      let both = false;
      if (k > 1) resp = await this.runPool(id, req, k, t0);
      else {
        this.track(id, 1);
        // With a second worker: a first look here (no reconciliation) and the whole audit there. The whole
        // audit starts once the first look is in (the first look then has the cores to itself, and a first
        // look with no galaxy left out is already whole), or at once if the main worker still owes an
        // earlier answer (a map, say), behind which the first look would wait.
        const second = this.secondReady ? this.slots[1] : undefined;
        const busy = main.pending > 0;
        both = second !== undefined && busy;
        const first = this.call(main, (api) => api.run(req, Comlink.proxy((done: number, total: number) => this.onProgress(id, main, 0, done, total)), second !== undefined));
        const wholeAudit = (): Promise<AuditResponse> => this.call(second!, (api) => api.run(req));
        whole = second && (busy ? wholeAudit() : first.then((r) => (id === this.seq && r.status === 'done' && (r.reconcileLeftOut ?? 0) > 0 ? wholeAudit() : r)));
        whole?.catch(() => undefined); // settled below, or dropped with a newer request
        resp = await Promise.race([first, whole ?? first]);
      }
      if (!resp || id !== this.seq || resp.status === 'cancelled') return;
      const full = await this.pages(id, main, resp);
      if (!full || id !== this.seq) return;
      const settling = (full.reconcileLeftOut ?? 0) > 0 && whole !== undefined;
      this.show(id, full, settling, csv, choices);
      if (settling) await this.settle(id, full, whole!, t0);
      else if (both) for (const s of this.slots.slice(0, 2)) void s.api.cancel(); // one answer was whole: the other is not needed
      else if (k === 1) this.readySecond(req);
    } catch (e) {
      if (id !== this.seq) return;
      this.progress = undefined;
      this.set({ status: 'error', settling: false, message: (e as Error).message || String(e) });
    }
  }

  /** Puts a response on show (a first look while `settling`, else the whole audit). */
  private show(id: number, response: AuditResponse, settling: boolean, csv: string, choices: AuditChoices): void {
    this.lastGood = { csv, choices };
    this.failures = 0;
    this.progress = undefined;
    const n = response.result?.galaxies.length ?? 0;
    // for the benchmarks: the moment the whole result is on the main thread, before the page draws it
    performance.clearMarks('baryon-audit:result');
    performance.mark('baryon-audit:result');
    this.set({ status: 'done', settling, response, done: n, total: n, secondsLeft: 0 });
  }

  /**
   * The whole audit after a first look: its rows (the first look's, with what it would take for the
   * galaxies in tension) and its reports replace those on show; the figures' data (the same numbers) stay.
   */
  private async settle(id: number, first: AuditResponse, whole: Promise<AuditResponse>, t0: number): Promise<void> {
    const w = await whole;
    if (id !== this.seq || w.status === 'cancelled') return;
    const response: AuditResponse = { ...first, result: w.result, markdown: w.markdown, csv: w.csv, reconcileLeftOut: undefined, elapsedMs: performance.now() - t0 };
    this.set({ settling: false, response });
  }

  /** Large samples: rows dealt over the pool; the leader (main worker) keeps its rows and finishes. */
  private async runPool(id: number, req: { id: number; csv: string; choices: AuditChoices }, k: number, t0: number): Promise<AuditResponse | undefined> {
    const slots = this.pool(k);
    this.track(id, k);
    const answers = await Promise.all(
      slots.map((s, w) =>
        this.call(s, (api) => api.runRows(req, { index: w, of: k }, Comlink.proxy((d: number, n: number) => this.onProgress(id, s, w, d, n)), w === 0) as Promise<string | number>),
      ),
    );
    if (id !== this.seq || answers.includes('cancelled')) return undefined;
    // The leader beats between the steps of finish(), so the liveness check hears it while it works.
    const lead = slots[0];
    return this.call(lead, (api) => api.finish(req, answers.slice(1) as string[], performance.now() - t0, Comlink.proxy(() => void (lead.lastHeard = performance.now()))));
  }

  /** A large result's rows, fetched page by page (no single message long to read). */
  private async pages(id: number, main: Slot, resp: AuditResponse): Promise<AuditResponse | undefined> {
    const n = resp.galaxyCount ?? 0;
    if (!resp.result || resp.result.galaxies.length === n) return resp;
    const galaxies: GalaxyRow[] = [];
    for (let from = 0; from < n; from += PAGE_ROWS) {
      const page = await this.call(main, (api) => api.galaxyPage(resp.id, from, Math.min(n, from + PAGE_ROWS)));
      if (id !== this.seq) return undefined;
      for (const g of page) galaxies.push(g);
    }
    return { ...resp, result: { ...resp.result, galaxies } };
  }

  /** Stops the run in flight; the last result stays on the page. */
  cancel(): void {
    this.seq++;
    this.progress = undefined;
    for (const s of this.slots) void s.api.cancel();
    this.set({ status: this.state.response ? 'done' : 'idle', settling: false, message: 'run cancelled', rowsPerSecond: undefined, secondsLeft: undefined });
  }

  async explore(req: ExplorerRequest): Promise<ExplorerResponse> {
    this.ensureStarted();
    return this.call(this.main, (api) => api.explore(req));
  }

  /** The map of the galaxy at `rowIndex` of the sample (the fifth figure), computed in the main worker. */
  async map(csv: string, choices: AuditChoices, rowIndex: number): Promise<DisputedMap> {
    this.ensureStarted();
    return this.call(this.main, (api) => api.map({ id: 0, csv, choices }, rowIndex));
  }

  /** The intrinsic UV slope β of an IMF under an SFH at an age (computed in the main worker). */
  async uvSlope(imf: string, sfh: string, metallicity: number, ageMyr: number, z: number): Promise<number> {
    this.ensureStarted();
    return this.call(this.main, (api) => api.uvSlope(imf, sfh, metallicity, ageMyr, z));
  }

  /** Parses a covariance CSV in the main worker (which has the CSV reader); rejects with the parser's message. */
  async parseCovariance(text: string, sourceName: string): Promise<ParamCovariance> {
    this.ensureStarted();
    return this.call(this.main, (api) => api.parseCovariance(text, sourceName));
  }

  /** Kills the worker as a crash would (used by the recovery tests). */
  kill(): void {
    this.crashed('the computation worker was stopped');
  }

  /** Asks the worker to throw (recovery tests). */
  async failInWorker(): Promise<void> {
    try {
      await this.call(this.main, (api) => api.fail('deliberate failure'));
    } catch (e) {
      this.set({ status: 'error', message: `worker error: ${(e as Error).message}` });
    }
  }

  /**
   * Recovery tests: the main worker (or a pool helper) stops at its next pause between rows with no error
   * event and no answer, as a worker killed by the browser would; only the liveness check can tell.
   */
  stopWorkerSilently(which: 'main' | 'pool' = 'main'): boolean {
    const s = which === 'main' ? this.slots[0] : this.slots[1];
    if (s) void s.api.stopSilently();
    return s !== undefined;
  }

  /** Recovery tests: the factory for workers started from now on (a script that cannot load, say). */
  setWorkerFactory(make: () => Worker): void {
    this.makeWorker = make;
  }

  dispose(): void {
    this.disposed = true;
    clearTimeout(this.restartTimer);
    clearInterval(this.watchdog);
    for (const s of this.slots) s.worker.terminate();
    this.slots = [];
  }
}

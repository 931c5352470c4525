import * as Comlink from 'comlink';
import type { AuditChoices } from '../core/audit/choices.js';
import type { DisputedMap } from '../core/audit/disputed-map.js';
import type { ParamCovariance } from '../core/cosmology/parameter-covariance.js';
import type { AuditApi, AuditResponse, ExplorerRequest, ExplorerResponse } from '../../workers/audit.worker.js';

export interface ControllerState {
  readonly status: 'idle' | 'running' | 'done' | 'error';
  readonly done: number;
  readonly total: number;
  readonly response?: AuditResponse;
  /** What went wrong, in words for the page (input problem or worker failure). */
  readonly message?: string;
  readonly restarts: number;
}

/**
 * The only UI code that knows about the worker. The latest request wins: a new run cancels the one in
 * flight and stale answers are dropped. A worker that dies (error event, or killed) is replaced and
 * the last inputs that completed are run again; the page is told what happened.
 */
export class AuditController {
  private worker!: Worker;
  private api!: Comlink.Remote<AuditApi>;
  private seq = 0;
  private lastGood?: { csv: string; choices: AuditChoices };
  private helpers: { worker: Worker; api: Comlink.Remote<AuditApi> }[] = [];
  state: ControllerState = { status: 'idle', done: 0, total: 0, restarts: 0 };

  /**
   * @param poolSize workers used for samples of at least POOL_MIN_ROWS rows (default: the machine's
   *   cores, at most 4); smaller samples use the one main worker.
   */
  constructor(
    private readonly onChange: (s: ControllerState) => void,
    private readonly makeWorker: () => Worker = () => new Worker(new URL('./audit.worker.js', import.meta.url), { type: 'module' }),
    private readonly poolSize = Math.max(1, Math.min(4, globalThis.navigator?.hardwareConcurrency ?? 1)),
  ) {
    this.start();
  }

  static readonly POOL_MIN_ROWS = 24;

  /** A new worker whose failure (error or unreadable message) restarts the whole set. */
  private spawn(role: string): { worker: Worker; api: Comlink.Remote<AuditApi> } {
    const worker = this.makeWorker();
    worker.addEventListener('error', (e) => {
      e.preventDefault();
      this.crashed(`${role} failed (${e.message || 'script error'})`);
    });
    worker.addEventListener('messageerror', () => this.crashed(`${role} sent a message that could not be read`));
    return { worker, api: Comlink.wrap<AuditApi>(worker) };
  }

  private helper(i: number): Comlink.Remote<AuditApi> {
    while (this.helpers.length <= i) this.helpers.push(this.spawn('a pool worker'));
    return this.helpers[i].api;
  }

  /** The main worker and the pool helpers. */
  private all(): { worker: Worker; api: Comlink.Remote<AuditApi> }[] {
    return [{ worker: this.worker, api: this.api }, ...this.helpers];
  }

  private set(s: Partial<ControllerState>): void {
    this.state = { ...this.state, ...s };
    this.onChange(this.state);
  }

  private start(): void {
    ({ worker: this.worker, api: this.api } = this.spawn('the computation worker'));
  }

  private crashed(why: string): void {
    for (const w of this.all()) w.worker.terminate();
    this.helpers = [];
    this.seq++;
    this.start();
    const redo = this.lastGood;
    this.set({ status: 'error', message: `${why}; it was restarted${redo ? ' and the last good inputs were run again' : ''}.`, restarts: this.state.restarts + 1 });
    if (redo) void this.run(redo.csv, redo.choices, true);
  }

  /** Runs an audit; resolves when this request is answered, superseded or failed. */
  async run(csv: string, choices: AuditChoices, keepMessage = false): Promise<void> {
    const id = ++this.seq;
    if (this.state.status === 'running') for (const w of this.all()) void w.api.cancel();
    this.set({ status: 'running', done: 0, total: 0, ...(keepMessage ? {} : { message: undefined }) });
    try {
      if (this.poolSize > 1 && csv.trim().split('\n').length - 1 >= AuditController.POOL_MIN_ROWS) {
        const rows = await this.api.rowCount(csv, choices);
        if (id !== this.seq) return;
        if (rows >= AuditController.POOL_MIN_ROWS) {
          await this.runPool(id, csv, choices, rows);
          return;
        }
      }
      const resp = await this.api.run(
        { id, csv, choices },
        Comlink.proxy((done: number, total: number) => {
          if (id === this.seq) this.set({ done, total });
        }),
      );
      if (id !== this.seq || resp.status === 'cancelled') return;
      this.lastGood = { csv, choices };
      this.set({ status: 'done', response: resp });
    } catch (e) {
      if (id !== this.seq) return;
      this.set({ status: 'error', message: (e as Error).message || String(e) });
    }
  }

  /** Large samples: rows dealt round-robin over the pool (same numbers: every row has its own stream). */
  private async runPool(id: number, csv: string, choices: AuditChoices, rows: number): Promise<void> {
    const t0 = performance.now();
    const k = Math.min(this.poolSize, rows);
    const parts: number[][] = Array.from({ length: k }, () => []);
    for (let i = 0; i < rows; i++) parts[i % k].push(i);
    const done = new Array(k).fill(0);
    const apis = [this.api, ...Array.from({ length: k - 1 }, (_, i) => this.helper(i))];
    const req = { id, csv, choices };
    const results = await Promise.all(
      apis.map((api, w) =>
        api.runRows(
          req,
          parts[w],
          Comlink.proxy((d: number) => {
            done[w] = d;
            if (id === this.seq) this.set({ done: done.reduce((a, b) => a + b, 0), total: rows });
          }),
        ),
      ),
    );
    if (id !== this.seq || results.some((r) => r === 'cancelled')) return;
    const galaxies = new Array(rows);
    for (const part of results) for (const [i, g] of part as [number, unknown][]) galaxies[i] = g;
    const resp = await this.api.finish(req, galaxies, performance.now() - t0);
    if (id !== this.seq) return;
    this.lastGood = { csv, choices };
    this.set({ status: 'done', response: resp });
  }

  /** Stops the run in flight; the last result stays on the page. */
  cancel(): void {
    this.seq++;
    for (const w of this.all()) void w.api.cancel();
    this.set({ status: this.state.response ? 'done' : 'idle', message: 'run cancelled' });
  }

  explore(req: ExplorerRequest): Promise<ExplorerResponse> {
    return this.api.explore(req);
  }

  /** The map of the galaxy at `rowIndex` of the sample (the fifth figure), computed in the main worker. */
  map(csv: string, choices: AuditChoices, rowIndex: number): Promise<DisputedMap> {
    return this.api.map({ id: 0, csv, choices }, rowIndex);
  }

  /** The intrinsic UV slope β of an IMF under an SFH at an age (computed in the main worker). */
  uvSlope(imf: string, sfh: string, metallicity: number, ageMyr: number, z: number): Promise<number> {
    return this.api.uvSlope(imf, sfh, metallicity, ageMyr, z);
  }

  /** Parses a covariance CSV in the main worker (which has the CSV reader); rejects with the parser's message. */
  parseCovariance(text: string, sourceName: string): Promise<ParamCovariance> {
    return this.api.parseCovariance(text, sourceName);
  }

  /** Kills the worker as a crash would (used by the recovery tests). */
  kill(): void {
    this.crashed('the computation worker was stopped');
  }

  /** Asks the worker to throw (recovery tests). */
  async failInWorker(): Promise<void> {
    try {
      await this.api.fail('deliberate failure');
    } catch (e) {
      this.set({ status: 'error', message: `worker error: ${(e as Error).message}` });
    }
  }

  dispose(): void {
    for (const w of this.all()) w.worker.terminate();
  }
}

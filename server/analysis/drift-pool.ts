import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { pairFlags, type PairFlags, type PairInput } from './pair-flags.js';

/** Whether this file runs as TypeScript through tsx (the server does, in production too) rather than compiled. */
const UNDER_TSX = import.meta.url.endsWith('.ts');
/** The worker's file beside this one: `.ts` through tsx, `.js` when compiled. */
const WORKER_URL = new URL(`./drift-worker${UNDER_TSX ? '.ts' : '.js'}`, import.meta.url);

/**
 * Starts one worker. On Node 20 a worker thread does not get the module hooks that `--import tsx`
 * registered in the main thread, so it could not load a `.ts` file ("Unknown file extension") and
 * every share fell back to the main thread. Under tsx the worker therefore first registers tsx's
 * ESM hooks (its documented `register()` API), then imports the worker file.
 */
function startWorker(): Worker {
  if (!UNDER_TSX) return new Worker(WORKER_URL);
  const tsxApi = import.meta.resolve('tsx/esm/api');
  return new Worker(`import(${JSON.stringify(tsxApi)}).then(({ register }) => { register(); return import(${JSON.stringify(WORKER_URL.href)}); });`, { eval: true });
}

/**
 * Worker threads for the drift overview's permutation tests, started on first use and kept (the
 * start costs a few hundred milliseconds of module loading). Idle workers do not keep the process
 * alive. If a worker cannot start or fails, its share is analysed in this thread instead, so a
 * missing worker slows the answer but never changes it.
 */
export class DriftPool {
  private workers: Worker[] | null = null;
  private nextId = 1;
  /** How many shares were analysed in this thread because their worker failed (tests keep it at 0). */
  fallbacks = 0;

  /** `size` workers; by default one per core the machine offers, at least 1 and at most 4. */
  constructor(private readonly size = Math.max(1, Math.min(4, availableParallelism()))) {}

  /** The flags of every pair, in the order given. */
  async run(pairs: readonly PairInput[]): Promise<PairFlags[]> {
    if (pairs.length === 0) return [];
    const workers = this.start();
    // Largest pairs first onto the least loaded worker (greedy balancing by readings).
    const shares: PairInput[][] = workers.map(() => []);
    const load = workers.map(() => 0);
    for (const p of [...pairs].sort((x, y) => y.l.length - x.l.length)) {
      const i = load.indexOf(Math.min(...load));
      shares[i]!.push(p);
      load[i]! += p.l.length;
    }
    const parts = await Promise.all(
      shares.map((share, i) =>
        share.length
          ? this.send(workers[i]!, share).catch(() => {
              this.fallbacks++;
              return share.map(pairFlags);
            })
          : Promise.resolve([]),
      ),
    );
    const byKey = new Map(parts.flat().map((r) => [r.key, r]));
    return pairs.map((p) => byKey.get(p.key)!);
  }

  /** Stops the workers (tests and shutdown). */
  async close(): Promise<void> {
    const workers = this.workers ?? [];
    this.workers = null;
    await Promise.all(workers.map((w) => w.terminate()));
  }

  private start(): Worker[] {
    if (!this.workers) {
      this.workers = Array.from({ length: this.size }, () => {
        const w = startWorker();
        w.unref();
        // A worker that dies is replaced on the next run.
        w.on('error', () => this.forget(w));
        w.on('exit', () => this.forget(w));
        return w;
      });
    }
    return this.workers;
  }

  private forget(w: Worker): void {
    if (this.workers?.includes(w)) this.workers = null;
  }

  private send(worker: Worker, pairs: PairInput[]): Promise<PairFlags[]> {
    const id = this.nextId++;
    // Held (ref) while any of its shares is out, so an awaiting script does not exit under it; idle
    // (unref) again once the last one is back. Counted, since runs may overlap on one worker.
    this.hold(worker, +1);
    return new Promise((resolve, reject) => {
      const onMessage = (m: { id: number; results: PairFlags[] }) => {
        if (m.id !== id) return;
        worker.off('message', onMessage);
        worker.off('error', onError);
        this.hold(worker, -1);
        resolve(m.results);
      };
      const onError = (err: Error) => {
        worker.off('message', onMessage);
        this.hold(worker, -1);
        reject(err);
      };
      worker.on('message', onMessage);
      worker.once('error', onError);
      worker.postMessage({ id, pairs });
    });
  }

  private readonly outstanding = new Map<Worker, number>();

  private hold(worker: Worker, change: 1 | -1): void {
    const n = (this.outstanding.get(worker) ?? 0) + change;
    this.outstanding.set(worker, n);
    if (n > 0) worker.ref();
    else {
      this.outstanding.delete(worker);
      worker.unref();
    }
  }
}

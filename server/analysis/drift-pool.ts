import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { pairFlags, type PairFlags, type PairInput } from './pair-flags.js';

/** The worker's file beside this one: `.ts` when run through tsx (workers inherit its `--import`), `.js` when compiled. */
const WORKER_URL = new URL(`./drift-worker${import.meta.url.endsWith('.ts') ? '.ts' : '.js'}`, import.meta.url);

/**
 * Worker threads for the drift overview's permutation tests, started on first use and kept (the
 * start costs a few hundred milliseconds of module loading). Idle workers do not keep the process
 * alive. If a worker cannot start or fails, its share is analysed in this thread instead, so a
 * missing worker slows the answer but never changes it.
 */
export class DriftPool {
  private workers: Worker[] | null = null;
  private nextId = 1;

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
    const parts = await Promise.all(shares.map((share, i) => (share.length ? this.send(workers[i]!, share).catch(() => share.map(pairFlags)) : Promise.resolve([]))));
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
        const w = new Worker(WORKER_URL);
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
    // Held (ref) while it works, so an awaiting script does not exit under it; idle again after.
    worker.ref();
    return new Promise((resolve, reject) => {
      const onMessage = (m: { id: number; results: PairFlags[] }) => {
        if (m.id !== id) return;
        worker.off('message', onMessage);
        worker.off('error', onError);
        worker.unref();
        resolve(m.results);
      };
      const onError = (err: Error) => {
        worker.off('message', onMessage);
        worker.unref();
        reject(err);
      };
      worker.on('message', onMessage);
      worker.once('error', onError);
      worker.postMessage({ id, pairs });
    });
  }
}

/**
 * A small pool of worker threads for long engine work (uncached dark windows, multi-year searches),
 * so that it never stalls the event loop that answers other requests.
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import type { EngineResult, EngineTask } from './engine-tasks';

interface Pending { resolve: (value: unknown) => void; reject: (error: Error) => void }
interface Slot { worker: Worker; busy: boolean; pending?: { id: number } & Pending }

const BOOTSTRAP = new URL('./engine-worker-bootstrap.mjs', import.meta.url);

export class EnginePool {
  private readonly slots: Slot[] = [];
  private readonly queue: Array<{ id: number; task: EngineTask } & Pending> = [];
  private nextId = 1;
  private closed = false;

  /** @param size - Worker threads; default one less than the cores, at least one. */
  constructor(private readonly size = Math.max(1, availableParallelism() - 1)) {}

  /** Runs the task on a worker; rejects with the worker's RangeError for refused input. */
  run<T extends EngineTask>(task: T): Promise<EngineResult<T>> {
    if (this.closed) return Promise.reject(new Error('The engine pool is closed'));
    return new Promise((resolve, reject) => {
      this.queue.push({ id: this.nextId++, task, resolve: resolve as (v: unknown) => void, reject });
      this.dispatch();
    });
  }

  private spawn(): Slot {
    const worker = new Worker(BOOTSTRAP);
    worker.unref();
    const slot: Slot = { worker, busy: false };
    worker.on('message', (m: { id: number; ok: boolean; result?: unknown; name?: string; message?: string }) => {
      const p = slot.pending;
      slot.pending = undefined;
      slot.busy = false;
      if (p && p.id === m.id) {
        if (m.ok) p.resolve(m.result);
        else {
          const error = m.name === 'RangeError' ? new RangeError(m.message) : new Error(m.message);
          p.reject(error);
        }
      }
      this.dispatch();
    });
    worker.on('error', (error) => {
      slot.pending?.reject(error);
      slot.pending = undefined;
      this.slots.splice(this.slots.indexOf(slot), 1);
      this.dispatch();
    });
    this.slots.push(slot);
    return slot;
  }

  private dispatch(): void {
    while (this.queue.length) {
      const slot = this.slots.find((s) => !s.busy) ?? (this.slots.length < this.size ? this.spawn() : undefined);
      if (!slot) return;
      const job = this.queue.shift()!;
      slot.busy = true;
      slot.pending = job;
      slot.worker.postMessage({ id: job.id, task: job.task });
    }
  }

  /** Stops the workers; queued tasks are refused. */
  async close(): Promise<void> {
    this.closed = true;
    for (const job of this.queue.splice(0)) job.reject(new Error('The engine pool is closed'));
    await Promise.all(this.slots.splice(0).map((s) => s.worker.terminate()));
  }
}

/**
 * One pool of worker threads for the whole build, shared by the stages that split their work
 * (reading the large tables, the trend tests), so each thread pays its start-up (loading the
 * modules) once. The pool knows no stage: a stage declares a task
 * with `defineTask(import.meta.url, 'exportName')` beside the function, and a worker imports that
 * module and calls the export. Tasks go to the first idle thread; results come back as the task's
 * promise. Idle threads do not keep the process alive.
 */
import { availableParallelism } from 'node:os';
import { Worker, type Transferable } from 'node:worker_threads';

/**
 * A function a worker thread can run: the module that exports it and its export name. `I` and `O`
 * are its input and output types (checked where the task is run; the function itself is checked
 * against them by `defineTask`'s caller with `satisfies TaskFunction<I, O>`).
 */
export interface Task<I, O> {
  readonly module: string;
  readonly name: string;
  /** Never set: carries the types. */
  readonly types?: (input: I) => O;
}

export type TaskFunction<I, O> = (input: I) => O;

/** The task that calls export `name` of the module at `moduleUrl` (pass `import.meta.url`). */
export function defineTask<I, O>(moduleUrl: string, name: string): Task<I, O> {
  return { module: moduleUrl, name };
}

interface Pending {
  resolve: (value: unknown) => void;
  reject: (error: Error) => void;
}

interface Slot {
  worker: Worker;
  busy: boolean;
}

interface Queued {
  id: number;
  module: string;
  name: string;
  input: unknown;
  transfer: Transferable[];
}

/**
 * The thread's entry: the compiled worker when this module is compiled (dist/), or a small entry
 * that registers tsx first when it runs from the TypeScript sources (tests, development).
 */
const WORKER_ENTRY = import.meta.url.endsWith('.ts') ? './workerEntry.js' : './worker.js';

export class WorkerPool {
  private readonly slots: Slot[] = [];
  private readonly queue: Queued[] = [];
  private readonly pending = new Map<number, Pending>();
  private nextId = 0;

  constructor(readonly size = defaultWorkers()) {}

  run<I, O>(task: Task<I, O>, input: I, transfer: Transferable[] = []): Promise<O> {
    const id = this.nextId++;
    const promise = new Promise<O>((resolve, reject) => this.pending.set(id, { resolve: resolve as (value: unknown) => void, reject }));
    this.queue.push({ id, module: task.module, name: task.name, input, transfer });
    this.dispatch();
    return promise;
  }

  async close(): Promise<void> {
    const slots = this.slots.splice(0);
    await Promise.all(slots.map((slot) => slot.worker.terminate()));
  }

  private dispatch(): void {
    while (this.queue.length > 0) {
      let slot = this.slots.find((candidate) => !candidate.busy);
      if (!slot && this.slots.length < this.size) slot = this.spawn();
      if (!slot) return;
      const task = this.queue.shift() as Queued;
      slot.busy = true;
      slot.worker.ref();
      slot.worker.postMessage({ id: task.id, module: task.module, name: task.name, input: task.input }, task.transfer);
    }
  }

  private spawn(): Slot {
    const worker = new Worker(new URL(WORKER_ENTRY, import.meta.url));
    const slot: Slot = { worker, busy: false };
    worker.on('message', (message: { id: number; output?: unknown; error?: string }) => {
      const pending = this.pending.get(message.id);
      this.pending.delete(message.id);
      slot.busy = false;
      worker.unref();
      if (message.error !== undefined) pending?.reject(new Error(message.error));
      else pending?.resolve(message.output);
      this.dispatch();
    });
    worker.on('error', (error) => {
      for (const pending of this.pending.values()) pending.reject(error);
      this.pending.clear();
    });
    this.slots.push(slot);
    return slot;
  }
}

/** Threads to use: the machine's cores, at most 8 (beyond that the copying dominates). */
export function defaultWorkers(): number {
  return Math.max(1, Math.min(8, availableParallelism()));
}

let shared: WorkerPool | null = null;

/** The process's pool, started on first use with `size` threads (default: the machine's cores, at most 8). */
export function sharedPool(size?: number): WorkerPool {
  shared ??= new WorkerPool(size);
  return shared;
}

/** Stops the process's pool (a later sharedPool() starts a new one). */
export async function closeSharedPool(): Promise<void> {
  const pool = shared;
  shared = null;
  await pool?.close();
}

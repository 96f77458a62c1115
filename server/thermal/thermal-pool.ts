// A small pool of worker threads for the thermal solver and sizing (thermal-tasks.ts): a model at
// the work bound that never settles computes for tens of seconds, which on the request thread held
// every other request meanwhile. Workers start when first needed and stay (unreferenced while idle);
// jobs wait in a short queue (beyond it 503 `busy`); a job whose request is gone (its AbortSignal)
// is dropped from the queue or, when running, its worker is ended and a fresh one takes its place.
// Under tsx (tests, `npm run dev`) the worker is server/thermal/thermal-worker.ts loaded with tsx;
// bundled (`npm start`) it is dist/server/thermal-worker.mjs beside main.mjs (scripts/build-server.mjs).
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { ApiError } from '../errors';
import { rebuildFailure, type TaskFailure, type ThermalTaskName, type ThermalTasks } from './thermal-tasks';

type Input<K extends ThermalTaskName> = Parameters<ThermalTasks[K]>[0];
type Output<K extends ThermalTaskName> = ReturnType<ThermalTasks[K]>;

interface Job {
  id: number;
  task: ThermalTaskName;
  input: unknown;
  resolve: (value: unknown) => void;
  reject: (error: Error) => void;
  signal?: AbortSignal;
  onAbort?: () => void;
}

interface Slot {
  worker: Worker;
  job: Job | null;
}

type Reply = { id: number; ok: true; value: unknown } | { id: number; ok: false; failure: TaskFailure };

/** Jobs that may wait for a worker; more are refused with 503 so a flood cannot queue unbounded work. */
const MAX_WAITING = 32;

/** The answer when the request that asked for the work has gone before it was done. */
export const cancelled = (): ApiError => new ApiError(400, 'cancelled', 'The request was cancelled before its answer was ready.');

const fromSource = import.meta.url.endsWith('.ts');
const workerUrl = new URL(fromSource ? './thermal-worker.ts' : './thermal-worker.mjs', import.meta.url);

export function defaultPoolSize(env: NodeJS.ProcessEnv = process.env): number {
  const raw = env.ECLIPTA_THERMAL_WORKERS;
  if (raw !== undefined && raw !== '') {
    const n = Number(raw);
    if (Number.isInteger(n) && n >= 1 && n <= 64) return n;
  }
  return Math.max(1, Math.min(2, availableParallelism() - 1));
}

export class ThermalPool {
  private readonly slots: Slot[] = [];
  private readonly waiting: Job[] = [];
  private nextId = 1;

  constructor(private readonly size = defaultPoolSize()) {}

  /** Runs a task in a worker; rejects with the task's own error class, or `cancelled()` on abort. */
  run<K extends ThermalTaskName>(task: K, input: Input<K>, signal?: AbortSignal): Promise<Output<K>> {
    if (signal?.aborted) return Promise.reject(cancelled());
    if (this.waiting.length >= MAX_WAITING && !this.slots.some((s) => !s.job) && this.slots.length >= this.size) {
      return Promise.reject(new ApiError(503, 'busy', `The server is running ${this.size + MAX_WAITING} thermal solves already; try again in a minute.`, undefined, { 'Retry-After': '30' }));
    }
    return new Promise<Output<K>>((resolve, reject) => {
      const job: Job = { id: this.nextId++, task, input, resolve: resolve as (v: unknown) => void, reject, ...(signal ? { signal } : {}) };
      if (signal) {
        job.onAbort = () => this.abort(job);
        signal.addEventListener('abort', job.onAbort, { once: true });
      }
      this.waiting.push(job);
      this.pump();
    });
  }

  /** Ends every worker (jobs still running or waiting are refused). */
  async close(): Promise<void> {
    for (const job of this.waiting.splice(0)) this.finish(job, cancelled());
    await Promise.all(this.slots.splice(0).map(async (slot) => {
      if (slot.job) this.finish(slot.job, cancelled());
      await slot.worker.terminate();
    }));
  }

  private pump(): void {
    while (this.waiting.length > 0) {
      let slot = this.slots.find((s) => !s.job);
      if (!slot) {
        if (this.slots.length >= this.size) return;
        slot = this.spawn();
      }
      const job = this.waiting.shift() as Job;
      slot.job = job;
      slot.worker.ref();
      slot.worker.postMessage({ id: job.id, task: job.task, input: job.input });
    }
  }

  private spawn(): Slot {
    const worker = fromSource
      // Node 20 loads a worker's entry before `--import tsx` hooks apply: register tsx, then import.
      ? new Worker(`import('tsx/esm/api').then(({ register }) => { register(); return import(${JSON.stringify(workerUrl.href)}); });`, { eval: true })
      : new Worker(workerUrl);
    const slot: Slot = { worker, job: null };
    worker.on('message', (reply: Reply) => {
      const job = slot.job;
      if (!job || job.id !== reply.id) return;
      slot.job = null;
      worker.unref();
      if (reply.ok) this.finish(job, null, reply.value);
      else this.finish(job, rebuildFailure(reply.failure));
      this.pump();
    });
    const lost = (error: Error) => {
      const index = this.slots.indexOf(slot);
      if (index < 0) return;
      this.slots.splice(index, 1);
      if (slot.job) this.finish(slot.job, error);
      slot.job = null;
      this.pump();
    };
    worker.on('error', lost);
    worker.on('exit', (code) => lost(new Error(`a thermal worker stopped (exit code ${code})`)));
    this.slots.push(slot);
    return slot;
  }

  private abort(job: Job): void {
    const queued = this.waiting.indexOf(job);
    if (queued >= 0) {
      this.waiting.splice(queued, 1);
      this.finish(job, cancelled());
      return;
    }
    const slot = this.slots.find((s) => s.job === job);
    if (!slot) return;
    // The solver has no place to stop between steps: its worker is ended and replaced.
    this.slots.splice(this.slots.indexOf(slot), 1);
    slot.job = null;
    this.finish(job, cancelled());
    void slot.worker.terminate();
    this.pump();
  }

  private finish(job: Job, error: Error | null, value?: unknown): void {
    if (job.signal && job.onAbort) job.signal.removeEventListener('abort', job.onAbort);
    if (error) job.reject(error);
    else job.resolve(value);
  }
}

/** The server's one pool. */
export const thermalPool = new ThermalPool();

/** A signal that aborts when the client goes away before its answer was sent in full. */
export function whileClientWaits(res: import('express').Response): AbortSignal {
  const controller = new AbortController();
  res.on('close', () => {
    if (!res.writableFinished) controller.abort();
  });
  return controller.signal;
}

// Work done after the answer has gone out, one job at a time, in the order given: the password
// reset mail, so that the answer to a reset request never depends on whether the address exists.
// A failing job is logged and the next one runs.
import type { Logger } from './logger';

export interface BackgroundWork {
  /** Queues a job; it starts on a later turn of the event loop, never inside the caller's request. */
  run(label: string, job: () => Promise<void>): void;
  /** Resolves when every job queued so far has finished (for shutdown and tests). */
  idle(): Promise<void>;
}

export function createBackgroundWork(logger: Logger): BackgroundWork {
  let tail: Promise<void> = Promise.resolve();
  return {
    run(label, job) {
      tail = tail
        .then(() => new Promise<void>((resolve) => setImmediate(resolve)))
        .then(job)
        .catch((err: unknown) => {
          logger.error(`${label} failed`, { error: err instanceof Error ? err : String(err) });
        });
    },
    idle: () => tail,
  };
}

/**
 * Work done after the answer has gone out, so the answer's timing tells nothing about it
 * (a password reset for an account that exists takes longer than for one that does not).
 * Failures are logged; `idle()` lets shutdown and tests wait for what is still running.
 */
import type { Logger } from 'pino';

export class BackgroundTasks {
  private readonly pending = new Set<Promise<void>>();
  private readonly logger: Logger;

  constructor(logger: Logger) {
    this.logger = logger;
  }

  /** Runs `task` on a later turn of the event loop, never inside the caller's request. */
  run(what: string, task: () => Promise<unknown>): void {
    const done = new Promise<void>((resolve) => setImmediate(resolve))
      .then(task)
      .then(
        () => undefined,
        (err: unknown) => this.logger.error({ err, task: what }, 'background task failed'),
      );
    this.pending.add(done);
    void done.finally(() => this.pending.delete(done));
  }

  /** Resolves once every task started so far (and any they started) has finished. */
  async idle(): Promise<void> {
    while (this.pending.size) await Promise.allSettled([...this.pending]);
  }
}

import type { Logger } from '@nestjs/common';

/**
 * The in-process queue of refit job ids: at most `concurrency` run at once, the rest wait in
 * arrival order. A job's own failure is logged, never thrown at whoever queued it.
 */
export class RefitQueue {
  private readonly waiting: number[] = [];
  private readonly inFlight = new Set<Promise<void>>();
  private stopping = false;

  constructor(
    private readonly run: (id: number) => Promise<void>,
    private readonly concurrency: number,
    private readonly logger: Logger,
  ) {}

  push(id: number): void {
    this.waiting.push(id);
    this.pump();
  }

  /** Resolves when no job is waiting or running (tests, shutdown). */
  async settled(): Promise<void> {
    while (this.inFlight.size > 0 || this.waiting.length > 0) await Promise.allSettled([...this.inFlight]);
  }

  /** Drops the waiting jobs and resolves when the running ones have ended. */
  async stop(): Promise<void> {
    this.stopping = true;
    this.waiting.length = 0;
    await Promise.allSettled([...this.inFlight]);
  }

  private pump(): void {
    while (!this.stopping && this.inFlight.size < this.concurrency && this.waiting.length > 0) {
      const id = this.waiting.shift()!;
      const run: Promise<void> = this.run(id)
        .catch((error: Error) => this.logger.error(`refit job ${id}: ${error.message}`))
        .finally(() => {
          this.inFlight.delete(run);
          this.pump();
        });
      this.inFlight.add(run);
    }
  }
}

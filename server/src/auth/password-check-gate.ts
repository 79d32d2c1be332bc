import { HttpStatus } from '@nestjs/common';
import { RetryLaterException } from '../common/http/retry-later.exception';

export const SIGN_IN_BUSY_MESSAGE = 'The server is busy checking other sign-ins; try again in a moment';

/**
 * A ceiling on concurrent password checks. One argon2id verify costs about 64 MiB and a few
 * hundred milliseconds of a core (RFC 9106 parameters), so sign-ins for unknown e-mails — each
 * verified against a decoy hash so timing does not tell them apart — would otherwise be a lever
 * to exhaust memory and CPU. At most `concurrency` checks run; `queue` more wait their turn;
 * beyond that the sign-in is answered 503 with Retry-After at once, without hashing.
 */
export class PasswordCheckGate {
  private running = 0;
  private readonly waiting: (() => void)[] = [];

  constructor(
    private readonly concurrency: number,
    private readonly queue: number,
    private readonly retryAfterSeconds = 2,
  ) {
    if (!Number.isInteger(concurrency) || concurrency < 1) throw new Error('PasswordCheckGate needs a concurrency of at least 1');
  }

  async run<T>(check: () => Promise<T>): Promise<T> {
    if (this.running >= this.concurrency) {
      if (this.waiting.length >= this.queue) {
        throw new RetryLaterException(HttpStatus.SERVICE_UNAVAILABLE, SIGN_IN_BUSY_MESSAGE, this.retryAfterSeconds);
      }
      await new Promise<void>((resolve) => this.waiting.push(resolve));
    } else {
      this.running++;
    }
    try {
      return await check();
    } finally {
      // Hand the slot straight to the next in line, or give it back.
      const next = this.waiting.shift();
      if (next) next();
      else this.running--;
    }
  }

  /** Checks running and waiting now (for tests and logs). */
  load(): { running: number; waiting: number } {
    return { running: this.running, waiting: this.waiting.length };
  }
}

import { AppError } from '../../../../shared/errors';
import { hashPassword, verifyPassword } from './passwords';

export interface PasswordHashingLimits {
  /** Hashes computed at once. scrypt runs on libuv's thread pool (4 threads by default), which
   * Web Crypto (session tokens) and file I/O share: two leaves them room under a sign-in flood. */
  running: number;
  /** Hashes allowed to wait for a slot; beyond this a sign-in is refused at once with 429. */
  waiting: number;
}

const DEFAULT_LIMITS: PasswordHashingLimits = { running: 2, waiting: 64 };

/**
 * Password hashing behind a semaphore: however many sign-ins arrive together, at most `running`
 * scrypt computations (32 MiB and tens of milliseconds each) run at once, so signed-in users'
 * requests keep their speed.
 */
export function createPasswordHashing(limits: PasswordHashingLimits = DEFAULT_LIMITS) {
  let running = 0;
  let peakRunning = 0;
  const queue: (() => void)[] = [];

  async function withSlot<T>(work: () => Promise<T>): Promise<T> {
    if (running >= limits.running) {
      if (queue.length >= limits.waiting) {
        throw new AppError('too_many_requests', 'Too many sign-ins at once. Try again in a few seconds.', {
          retryAfterSeconds: 5,
        });
      }
      // The slot is handed over by the finishing hash, so `running` stays counted through the hand-over.
      await new Promise<void>((resolve) => queue.push(resolve));
    } else {
      running += 1;
    }
    peakRunning = Math.max(peakRunning, running);
    try {
      return await work();
    } finally {
      const next = queue.shift();
      if (next) next();
      else running -= 1;
    }
  }

  return {
    hash: (password: string) => withSlot(() => hashPassword(password)),
    verify: (password: string, stored: string) => withSlot(() => verifyPassword(password, stored)),
    /** For tests and the health of the server: hashes running now, waiting, and the most ever at once. */
    stats: () => ({ running, waiting: queue.length, peakRunning }),
  };
}

export type PasswordHashing = ReturnType<typeof createPasswordHashing>;

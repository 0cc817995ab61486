import { AppError } from '../../../platform/app-error';
import type { SignInFailuresRepository } from '../data/sign-in-failures-repository';
import { refusal, type SignInPolicy } from './sign-in-policy';

/** Sign-ins for one account waiting their turn in this process beyond this many are refused at once. */
const MAX_WAITING_PER_ACCOUNT = 200;

export interface SignInAttempt {
  email: string;
  /** The client's address as Express sees it (`trust proxy` decides whether X-Forwarded-For counts). */
  address: string;
}

/**
 * Applies the sign-in policy around a password check. Attempts for one account run one at a time in this process,
 * so a burst of parallel guesses is counted guess by guess instead of all passing the check before the first
 * failure is written, and a burst of right passwords all succeed (they are never counted).
 */
export class SignInThrottle {
  private readonly turns = new Map<string, { tail: Promise<unknown>; waiting: number }>();

  constructor(
    private readonly failures: SignInFailuresRepository,
    private readonly policy: SignInPolicy,
    private readonly clock: () => number = Date.now,
  ) {}

  /** Runs `check` (null = wrong e-mail or password) when the policy allows it; throws 429 when it does not. */
  attempt<T>(who: SignInAttempt, check: () => Promise<T | null>): Promise<T | null> {
    const key = who.email;
    const turn = this.turns.get(key) ?? { tail: Promise.resolve(), waiting: 0 };
    if (turn.waiting >= MAX_WAITING_PER_ACCOUNT)
      throw AppError.rateLimited('Too many sign-ins for this account at once. Try again in a moment.', 5);
    turn.waiting++;
    const run = turn.tail.then(() => this.checked(who, check));
    turn.tail = run.catch(() => undefined);
    this.turns.set(key, turn);
    return run.finally(() => {
      if (--turn.waiting === 0) this.turns.delete(key);
    });
  }

  private async checked<T>(who: SignInAttempt, check: () => Promise<T | null>): Promise<T | null> {
    const account = `account:${who.email}`;
    const address = `address:${who.address}|${who.email}`;
    const now = this.clock();
    const counts = await this.failures.read([account, address], new Date(now));
    const refused = refusal({ account: counts.get(account), address: counts.get(address) }, this.policy, now);
    if (refused) {
      const wait = refused.retryAfterSeconds;
      throw AppError.rateLimited(
        refused.scope === 'address'
          ? `Too many failed sign-ins for this account from your address. Wait ${Math.ceil(wait / 60)} minute(s) ` +
              'and try again, or ask your administrator to reset your password.'
          : `Too many failed sign-ins for this account. Wait ${wait} second(s) and try again; each further wrong ` +
              `password makes the wait longer (at most ${Math.round(this.policy.maxDelayMs / 1000)} s).`,
        wait,
      );
    }
    const result = await check();
    if (result === null)
      await this.failures.recordFailure([account, address], new Date(this.clock()), this.policy.windowMs);
    else await this.failures.clear(address);
    return result;
  }
}

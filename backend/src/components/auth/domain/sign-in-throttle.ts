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

/** One account's attempts in this process: how many run, how many may, and who waits for a turn. */
interface Lane {
  running: number;
  /** Failures the account has (the highest count seen while this lane lives); -1 until first read. */
  failed: number;
  waiting: Array<() => void>;
}

/**
 * Applies the sign-in policy around a password check. Per account, no more attempts run at once in this process
 * than the account has failures left before its limit, so a burst of parallel guesses can never slip past the
 * count (each is counted before the allowance is spent); right passwords are never counted, so a burst of them
 * all succeed, a few at a time.
 */
export class SignInThrottle {
  private readonly lanes = new Map<string, Lane>();

  constructor(
    private readonly failures: SignInFailuresRepository,
    private readonly policy: SignInPolicy,
    private readonly clock: () => number = Date.now,
  ) {}

  /** Runs `check` (null = wrong e-mail or password) when the policy allows it; throws 429 when it does not. */
  async attempt<T>(who: SignInAttempt, check: () => Promise<T | null>): Promise<T | null> {
    const lane = this.lanes.get(who.email) ?? { running: 0, failed: -1, waiting: [] };
    this.lanes.set(who.email, lane);
    if (lane.waiting.length >= MAX_WAITING_PER_ACCOUNT)
      throw AppError.rateLimited('Too many sign-ins for this account at once. Try again in a moment.', 5);
    while (lane.running >= this.allowance(lane)) await new Promise<void>((turn) => lane.waiting.push(turn));
    lane.running++;
    try {
      return await this.checked(who, check, lane);
    } finally {
      lane.running--;
      this.wake(who.email, lane);
    }
  }

  /**
   * Attempts that may run at once: the failures the account has left before it is limited, counting the ones in
   * flight as if they will fail (at least one; one until the count has been read).
   */
  private allowance(lane: Lane): number {
    return lane.failed < 0 ? 1 : Math.max(1, this.policy.maxAttempts - lane.failed);
  }

  /** Lets waiting attempts re-check for a free turn; forgets an idle account. */
  private wake(email: string, lane: Lane): void {
    const free = Math.max(0, this.allowance(lane) - lane.running);
    for (const turn of lane.waiting.splice(0, free)) turn();
    if (lane.running === 0 && lane.waiting.length === 0) this.lanes.delete(email);
  }

  private async checked<T>(who: SignInAttempt, check: () => Promise<T | null>, lane: Lane): Promise<T | null> {
    const account = `account:${who.email}`;
    const address = `address:${who.address}|${who.email}`;
    const now = this.clock();
    const counts = await this.failures.read([account, address], new Date(now));
    const counted = { account: counts.get(account), address: counts.get(address) };
    const refused = refusal(counted, this.policy, now);
    const failed = Math.max(counted.account?.failures ?? 0, counted.address?.failures ?? 0);
    lane.failed = Math.max(lane.failed, failed);
    this.wake(who.email, lane);
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
    if (result === null) {
      await this.failures.recordFailure([account, address], new Date(this.clock()), this.policy.windowMs);
      lane.failed++;
    } else await this.failures.clear(address);
    return result;
  }
}

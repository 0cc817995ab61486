import type { FailureCount } from '../data/sign-in-failures-repository';

export interface SignInPolicy {
  /** Failed sign-ins allowed per address and account, and per account before delays begin. */
  maxAttempts: number;
  /** A count starts again after this long without a failure. */
  windowMs: number;
  /** The longest delay an account's failures can impose between two attempts. */
  maxDelayMs: number;
}

export interface Refusal {
  scope: 'address' | 'account';
  retryAfterSeconds: number;
}

/**
 * Whether a sign-in may be tried now. Only wrong passwords are ever counted, so right ones never lock anybody out.
 * - Per address and account: after `maxAttempts` failures, that address waits until the window is over (the lock
 *   binds the address that guessed, not the account's owner elsewhere).
 * - Per account, whatever the address: after `maxAttempts` failures each further attempt waits 1 s, 2 s, 4 s …
 *   (doubling per failure, at most `maxDelayMs`) after the last failure. Guessing from many addresses is slowed to
 *   one try per delay, while the real user waits seconds to minutes at worst, never a long lock-out.
 *   (Growing delays instead of lock-outs: common practice, no source.)
 */
export function refusal(
  counts: { address?: FailureCount; account?: FailureCount },
  policy: SignInPolicy,
  now: number,
): Refusal | null {
  const { address, account } = counts;
  if (address && address.failures >= policy.maxAttempts && address.windowUntil.getTime() > now) {
    return { scope: 'address', retryAfterSeconds: Math.ceil((address.windowUntil.getTime() - now) / 1000) };
  }
  if (account && account.failures >= policy.maxAttempts) {
    const delay = accountDelayMs(account.failures, policy);
    const until = account.lastFailureAt.getTime() + delay;
    if (until > now) return { scope: 'account', retryAfterSeconds: Math.ceil((until - now) / 1000) };
  }
  return null;
}

/** The wait after an account's n-th failure in a row (0 before `maxAttempts`). */
export function accountDelayMs(failures: number, policy: SignInPolicy): number {
  if (failures < policy.maxAttempts) return 0;
  return Math.min(policy.maxDelayMs, 1000 * 2 ** (failures - policy.maxAttempts));
}

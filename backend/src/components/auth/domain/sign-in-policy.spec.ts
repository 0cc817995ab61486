import { describe, expect, it } from 'vitest';
import { accountDelayMs, refusal, type SignInPolicy } from './sign-in-policy';

const policy: SignInPolicy = { maxAttempts: 5, windowMs: 15 * 60_000, maxDelayMs: 60_000 };
const now = Date.parse('2026-12-05T10:00:00Z');
const count = (failures: number, secondsAgo: number) => ({
  failures,
  lastFailureAt: new Date(now - secondsAgo * 1000),
  windowUntil: new Date(now - secondsAgo * 1000 + policy.windowMs),
});

describe('sign-in policy', () => {
  it('when an account has failed fewer times than allowed, then nothing waits', () => {
    expect(refusal({ account: count(4, 0), address: count(4, 0) }, policy, now)).toBeNull();
  });

  it('when one address has used up its attempts for an account, then it waits for the rest of the window', () => {
    expect(refusal({ address: count(5, 60) }, policy, now)).toEqual({ scope: 'address', retryAfterSeconds: 840 });
  });

  it(
    'when an account has failed from many addresses, then each further try waits a doubling delay, ' + 'at most 60 s',
    () => {
      expect([5, 6, 7, 8, 11, 12, 40].map((n) => accountDelayMs(n, policy))).toEqual([
        1_000, 2_000, 4_000, 8_000, 60_000, 60_000, 60_000,
      ]);
      expect(refusal({ account: count(7, 1) }, policy, now)).toEqual({ scope: 'account', retryAfterSeconds: 3 });
      expect(refusal({ account: count(7, 5) }, policy, now)).toBeNull();
    },
  );
});

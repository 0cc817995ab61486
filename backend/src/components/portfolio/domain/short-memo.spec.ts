import { describe, expect, it } from 'vitest';
import { ShortMemo } from './short-memo';

describe('ShortMemo', () => {
  it('when asked twice within the time-to-live, then it computes once; after it, again', async () => {
    const memo = new ShortMemo<number>(1000);
    let calls = 0;
    const compute = async () => ++calls;
    expect(await memo.get('k', compute, 0)).toBe(1);
    expect(await memo.get('k', compute, 999)).toBe(1);
    expect(await memo.get('k', compute, 1000)).toBe(2);
    expect(await memo.get('other', compute, 1000)).toBe(3);
  });

  it('when callers ask at the same time, then they share one computation; a failure is not remembered', async () => {
    const memo = new ShortMemo<number>(1000);
    let calls = 0;
    const [a, b] = await Promise.all([memo.get('k', async () => ++calls, 0), memo.get('k', async () => ++calls, 0)]);
    expect([a, b, calls]).toEqual([1, 1, 1]);
    await expect(memo.get('bad', () => Promise.reject(new Error('db down')), 0)).rejects.toThrow('db down');
    await Promise.resolve();
    expect(await memo.get('bad', async () => 7, 1)).toBe(7);
  });
});

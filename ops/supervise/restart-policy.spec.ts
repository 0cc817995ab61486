import { describe, expect, it } from 'vitest';
import { restartDelayMs, whyItStopped } from './restart-policy';

describe('supervisor restart policy', () => {
  it('when the server crashes again and again, then the wait doubles from 1 s up to 30 s', () => {
    expect([1, 2, 3, 4, 5, 6, 7, 20].map((n) => restartDelayMs(n))).toEqual([
      1_000, 2_000, 4_000, 8_000, 16_000, 30_000, 30_000, 30_000,
    ]);
  });

  it('when the server exits, then the line says why in words, with its last error', () => {
    expect(whyItStopped(70, null, '2026-12-05T08:00:00Z ERROR uncaught exception: boom')).toBe(
      'exit code 70: an uncaught exception; its last error: 2026-12-05T08:00:00Z ERROR uncaught exception: boom',
    );
    expect(whyItStopped(null, 'SIGKILL', '')).toMatch(/^killed \(SIGKILL/);
    expect(whyItStopped(3, null, '')).toBe('exit code 3');
  });
});

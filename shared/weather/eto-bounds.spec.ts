import { describe, expect, it } from 'vitest';
import { validateEto } from './eto-bounds';

describe('validateEto', () => {
  it('accepts 0 to 20 mm/d and rejects the rest with a reason', () => {
    expect(validateEto(0)).toEqual({ ok: true });
    expect(validateEto(7.5)).toEqual({ ok: true });
    expect(validateEto(20)).toEqual({ ok: true });
    expect(validateEto(20.1)).toMatchObject({ ok: false, message: expect.stringContaining('above 20 mm/d') });
    expect(validateEto(-0.1)).toMatchObject({ ok: false, message: expect.stringContaining('negative') });
    expect(validateEto(Number.NaN).ok).toBe(false);
  });
});

/** A small seeded PRNG (mulberry32) so every synthetic site is the same on every machine and every run. */

export interface Random {
  /** Uniform in [0, 1). */
  next(): number;
  uniform(min: number, max: number): number;
  /** Whole number in [min, max]. */
  int(min: number, max: number): number;
  /** Normal via Box–Muller. */
  normal(mean: number, sd: number): number;
  chance(probability: number): boolean;
  pick<T>(items: readonly T[]): T;
}

export function seededRandom(seed: number): Random {
  let state = seed >>> 0;
  const next = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296;
  };
  return {
    next,
    uniform: (min, max) => min + (max - min) * next(),
    int: (min, max) => min + Math.floor(next() * (max - min + 1)),
    normal: (mean, sd) => mean + sd * Math.sqrt(-2 * Math.log(1 - next())) * Math.cos(2 * Math.PI * next()),
    chance: (p) => next() < p,
    pick: (items) => items[Math.floor(next() * items.length)]!,
  };
}

/** A stable 32-bit seed from a text label (FNV-1a), so scenario seeds read as names, not magic numbers. */
export function seedFrom(label: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < label.length; i++) h = Math.imul(h ^ label.charCodeAt(i), 0x01000193) >>> 0;
  return h;
}

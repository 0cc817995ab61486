/**
 * Remembers a computed value for a few seconds, and shares one computation between callers asking at the
 * same time. The portfolio's sums over every visible site cost one heavy query; a manager paging, sorting or
 * filtering the table, or 20 people opening the home page at 9 am, should not repeat it. The price: figures
 * may lag an upload by up to the time-to-live.
 */
export class ShortMemo<T> {
  private readonly entries = new Map<string, { at: number; value: Promise<T> }>();

  constructor(
    private readonly ttlMs: number,
    private readonly maxEntries = 500,
  ) {}

  get(key: string, compute: () => Promise<T>, now = Date.now()): Promise<T> {
    const hit = this.entries.get(key);
    if (hit && now - hit.at < this.ttlMs) return hit.value;
    if (this.entries.size >= this.maxEntries) this.entries.clear();
    const value = compute();
    this.entries.set(key, { at: now, value });
    // A failure is not remembered: the next caller tries again.
    value.catch(() => this.entries.delete(key));
    return value;
  }
}

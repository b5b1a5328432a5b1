/**
 * Entries with a byte size, kept in insertion order of last use and bounded by their total bytes: the
 * entry used least recently goes first, and one larger than the whole bound is never kept. The store
 * behind JsonCache and AnswerCache; each decides when an entry is still good.
 */
export class ByteLru<E extends { body: Buffer }> {
  private entries = new Map<string, E>();
  private bytes = 0;

  constructor(private readonly maxBytes: number) {}

  /** The entry when `good` says it still holds (it then counts as used), else drops it. */
  get(key: string, good: (e: E) => boolean): E | undefined {
    const e = this.entries.get(key);
    if (!e) return undefined;
    if (!good(e)) {
      this.drop(key);
      return undefined;
    }
    this.entries.delete(key);
    this.entries.set(key, e);
    return e;
  }

  set(key: string, e: E) {
    this.drop(key);
    if (e.body.length > this.maxBytes) return;
    this.entries.set(key, e);
    this.bytes += e.body.length;
    for (const [k] of this.entries) {
      if (this.bytes <= this.maxBytes) break;
      this.drop(k);
    }
  }

  get size() {
    return this.entries.size;
  }

  drop(key: string) {
    const e = this.entries.get(key);
    if (e) {
      this.bytes -= e.body.length;
      this.entries.delete(key);
    }
  }
}

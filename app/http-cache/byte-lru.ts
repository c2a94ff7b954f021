// A least-recently-used map bounded by the bytes of its values: a Map keeps insertion order, so the
// first key is the oldest use. Pure; no framework.

export class ByteLru<V> {
  private readonly entries = new Map<string, { value: V; size: number }>();
  private used = 0;

  constructor(
    private readonly maxBytes: number,
    private readonly sizeOf: (value: V, key: string) => number,
  ) {}

  get bytes() {
    return this.used;
  }

  get size() {
    return this.entries.size;
  }

  get(key: string): V | undefined {
    const entry = this.entries.get(key);
    if (!entry) return undefined;
    // Moves the key to the newest end.
    this.entries.delete(key);
    this.entries.set(key, entry);
    return entry.value;
  }

  set(key: string, value: V): void {
    const size = this.sizeOf(value, key);
    this.delete(key);
    if (size > this.maxBytes) return;
    this.entries.set(key, { value, size });
    this.used += size;
    for (const [oldest, entry] of this.entries) {
      if (this.used <= this.maxBytes) break;
      this.entries.delete(oldest);
      this.used -= entry.size;
    }
  }

  delete(key: string): void {
    const entry = this.entries.get(key);
    if (!entry) return;
    this.entries.delete(key);
    this.used -= entry.size;
  }

  clear(): void {
    this.entries.clear();
    this.used = 0;
  }
}

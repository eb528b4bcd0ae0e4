// Where each source element landed in a written version of the tune (the skeleton's bars are
// measured on its own text).

/**
 * Source offset → output offset, recorded at each element's start and end as the walk goes.
 * The walk only moves forward, so the keys come in order and a lookup is a binary search for the
 * last entry with its key (the value a map would hold after the same writes), with none of a
 * map's hashing for the many entries that are never read. The entries sit in typed arrays sized
 * once for the walk: nothing for the garbage collector to trace or copy, however long the tune.
 */
export class Offsets {
  private keys: Int32Array;
  private vals: Int32Array;
  private n = 0;
  private ordered = true;
  /** `capacity`: the most entries the walk records (two for each element). */
  constructor(capacity: number) {
    this.keys = new Int32Array(capacity);
    this.vals = new Int32Array(capacity);
  }
  set(key: number, value: number): void {
    const n = this.n;
    if (n === this.keys.length) this.grow();
    if (n > 0 && key < this.keys[n - 1]) this.ordered = false; // an element ending before it starts
    this.keys[n] = key;
    this.vals[n] = value;
    this.n = n + 1;
  }
  get(key: number): number | undefined {
    const keys = this.keys;
    if (!this.ordered) {
      // (unordered means at least two entries, so the search starts at the last one written)
      const i = keys.lastIndexOf(key, this.n - 1);
      return i >= 0 ? this.vals[i] : undefined;
    }
    let lo = 0;
    let hi = this.n;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (keys[mid] <= key) lo = mid + 1;
      else hi = mid;
    }
    return lo > 0 && keys[lo - 1] === key ? this.vals[lo - 1] : undefined;
  }
  private grow(): void {
    const keys = new Int32Array(Math.max(16, this.keys.length * 2));
    const vals = new Int32Array(keys.length);
    keys.set(this.keys);
    vals.set(this.vals);
    this.keys = keys;
    this.vals = vals;
  }
}

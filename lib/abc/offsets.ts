// Where each source element landed in a written version of the tune (the skeleton's bars are
// measured on its own text).

/**
 * Source offset → output offset, recorded at each element's start and end as the walk goes.
 * The walk only moves forward, so the keys come in order and a lookup is a binary search for the
 * last entry with its key (the value a map would hold after the same writes), with none of a
 * map's hashing for the many entries that are never read.
 */
export class Offsets {
  private keys: number[] = [];
  private vals: number[] = [];
  private ordered = true;
  set(key: number, value: number): void {
    const n = this.keys.length;
    if (n > 0 && key < this.keys[n - 1]) this.ordered = false; // an element ending before it starts
    this.keys.push(key);
    this.vals.push(value);
  }
  get(key: number): number | undefined {
    const keys = this.keys;
    if (!this.ordered) {
      const i = keys.lastIndexOf(key);
      return i >= 0 ? this.vals[i] : undefined;
    }
    let lo = 0;
    let hi = keys.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (keys[mid] <= key) lo = mid + 1;
      else hi = mid;
    }
    return lo > 0 && keys[lo - 1] === key ? this.vals[lo - 1] : undefined;
  }
}

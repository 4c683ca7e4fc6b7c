// A Float64Array that grows by doubling, for data whose length is known only at the end of a file.

export class GrowableFloat64 {
  private buffer: Float64Array;
  length = 0;

  constructor(capacity = 1024) {
    this.buffer = new Float64Array(Math.max(16, capacity));
  }

  /** Append `count` zeros and return the index of the first. */
  extend(count: number): number {
    const start = this.length;
    const needed = start + count;
    if (needed > this.buffer.length) {
      let size = this.buffer.length;
      while (size < needed) size *= 2;
      const next = new Float64Array(size);
      next.set(this.buffer.subarray(0, start));
      this.buffer = next;
    }
    this.length = needed;
    return start;
  }

  push(value: number): void {
    this.buffer[this.extend(1)] = value;
  }

  set(index: number, value: number): void {
    this.buffer[index] = value;
  }

  get(index: number): number {
    return this.buffer[index];
  }

  /** The values as an array of exactly `length` (a copy). */
  toArray(): Float64Array {
    return this.buffer.slice(0, this.length);
  }
}

/**
 * A list of numbers that grows as a file is read, held in one Float64Array (8 bytes a value, no
 * boxed numbers, no array of row objects). Capacity grows by half each time: while it grows the
 * old and the new buffer live together, so the peak is 2.5 × 8 = 20 bytes per value kept, and
 * `view()` hands the values over without a copy.
 */
export class GrowableNumbers {
  private buffer: Float64Array;
  private size = 0;

  constructor(capacity = 1024) {
    this.buffer = new Float64Array(Math.max(16, capacity));
  }

  get length(): number {
    return this.size;
  }

  push(value: number): void {
    if (this.size === this.buffer.length) {
      const next = new Float64Array(Math.ceil(this.buffer.length * 1.5));
      next.set(this.buffer);
      this.buffer = next;
    }
    this.buffer[this.size++] = value;
  }

  at(index: number): number {
    return this.buffer[index] as number;
  }

  /** The values pushed so far, as a view of the buffer (no copy; later pushes may detach it). */
  view(): Float64Array {
    return this.buffer.subarray(0, this.size);
  }
}

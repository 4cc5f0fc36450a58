/**
 * A list of numbers that grows as a file is read, held in one Float64Array (8 bytes a value, no
 * boxed numbers, no array of row objects), and `view()` hands the values over without a copy.
 * While the buffer grows the old and the new one live together. Below a million values it grows
 * by half (few copies); beyond, by an eighth, so that growing holds at most 2.125 × 8 = 17 bytes a
 * value kept, and the buffer handed over (kept as long as the values) has at most an eighth of
 * it unused. Copies stay linear: each value is copied at most about eight times over.
 */
/** From this many values the buffer grows by an eighth instead of by half. */
const LARGE = 1 << 20;

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
      const length = this.buffer.length;
      const next = new Float64Array(Math.ceil(length * (length < LARGE ? 1.5 : 1.125)));
      next.set(this.buffer);
      this.buffer = next;
    }
    this.buffer[this.size++] = value;
  }

  at(index: number): number {
    return this.buffer[index] as number;
  }

  /** Empties the list and lets go of its buffer (views handed out keep theirs alive). */
  release(): void {
    this.buffer = new Float64Array(16);
    this.size = 0;
  }

  /** The values pushed so far, as a view of the buffer (no copy; later pushes may detach it). */
  view(): Float64Array {
    return this.buffer.subarray(0, this.size);
  }
}

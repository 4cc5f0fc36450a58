/**
 * Reproducible random draws for Monte Carlo and permutation references, seeded from the data.
 *
 * A recalculation must never change a cell, and a batch split into parts must give each series the
 * same p-value as the whole batch, so every reference draws from a stream whose seed is a hash of
 * the series' own values, their positions and the options that shape the statistic — never the
 * clock and never a stream shared with other series.
 *
 * - Seed: 64-bit FNV-1a (Fowler, Noll & Vo; the published offset basis and prime) over the bytes
 *   of each present value's IEEE-754 bits, its position and the option words, folded to four
 *   32-bit words by SplitMix32 (the 32-bit form of Steele, Lea & Flood 2014, OOPSLA, "Fast
 *   splittable pseudorandom number generators").
 * - Stream: xoshiro128** (Blackman & Vigna 2021, ACM TOMS 47(4):36), period 2^128 − 1, which
 *   passes the BigCrush battery; ample for the 10^5 draws of one reference.
 * - Integers below m: Lemire's multiply-and-reject method (2019, ACM TOMACS 29(1):3), unbiased.
 * - Normals: Box–Muller (1958, Ann. Math. Stat. 29:610–611).
 * Cost O(n) to seed, O(1) a number.
 */

export interface DrawStream {
  /** Uniform 32-bit unsigned integer. */
  nextUint32(): number;
  /** Uniform integer in [0, bound), bound ≤ 2^32, without modulo bias. */
  below(bound: number): number;
  /** Uniform on (0, 1). */
  uniform(): number;
  /** Standard normal. */
  normal(): number;
  /** Fisher–Yates shuffle of `values` in place (Durstenfeld 1964, CACM 7:420), unbiased. */
  shuffle(values: Float64Array): void;
}

/** Accumulates the seed: 64-bit FNV-1a kept as two 32-bit halves. */
export class SeedHash {
  private hi = 0xcbf29ce4;
  private lo = 0x84222325;
  private readonly scratch = new DataView(new ArrayBuffer(8));

  /** Mixes one byte: h ^= b; h *= 0x100000001b3 (mod 2^64). */
  private byte(b: number): void {
    this.lo ^= b & 0xff;
    // h * (2^40 + 0x1b3) = h * 0x1b3 + (h << 40).
    const lo = this.lo >>> 0;
    const hi = this.hi >>> 0;
    const loTimes = lo * 0x1b3;
    const newLo = loTimes >>> 0;
    const carry = Math.floor(loTimes / 4294967296);
    const newHi = (Math.imul(hi, 0x1b3) + carry + ((lo << 8) >>> 0)) >>> 0;
    this.lo = newLo;
    this.hi = newHi;
  }

  /** Mixes the eight bytes of a double's bit pattern. */
  number(x: number): this {
    this.scratch.setFloat64(0, x);
    for (let i = 0; i < 8; i++) this.byte(this.scratch.getUint8(i));
    return this;
  }

  /** Mixes a word's UTF-16 code units (two bytes each), then a separator. */
  word(text: string): this {
    for (let i = 0; i < text.length; i++) {
      const c = text.charCodeAt(i);
      this.byte(c);
      this.byte(c >>> 8);
    }
    this.byte(0xff);
    return this;
  }

  /** The stream this seed starts. */
  stream(): DrawStream {
    return xoshiro128(this.hi >>> 0, this.lo >>> 0);
  }
}

/** Bounds up to 2^21 keep x·bound below 2^53, where Lemire's product is exact in a double. */
const SMALL_BOUND = 2 ** 21;

function splitMix32(state: { s: number }): number {
  state.s = (state.s + 0x9e3779b9) | 0;
  let z = state.s;
  z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
  return (z ^ (z >>> 16)) >>> 0;
}

/** xoshiro128** seeded through SplitMix32 from two 32-bit words. */
export function xoshiro128(seedHi: number, seedLo: number): DrawStream {
  const mix = { s: seedHi ^ Math.imul(seedLo, 0x27d4eb2d) };
  let s0 = splitMix32(mix) ^ seedLo;
  let s1 = splitMix32(mix);
  let s2 = splitMix32(mix) ^ seedHi;
  let s3 = splitMix32(mix);
  if ((s0 | s1 | s2 | s3) === 0) s0 = 1;
  let spare: number | null = null;

  const nextUint32 = (): number => {
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9) >>> 0;
    const t = s1 << 9;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = rotl(s3, 11);
    return result;
  };
  const below = (bound: number): number => {
    if (bound > SMALL_BOUND) {
      // 53 random bits times the bound: a bias below 2^-30, far beyond any draw count used here.
      const bits = (nextUint32() >>> 5) * 67108864 + (nextUint32() >>> 6);
      return Math.floor((bits / 9007199254740992) * bound);
    }
    // Lemire: floor(x·m / 2^32), rejecting the biased low products. x·m < 2^53 is exact here.
    let product = nextUint32() * bound;
    let low = product >>> 0;
    if (low < bound) {
      const threshold = (4294967296 - bound) % bound;
      while (low < threshold) {
        product = nextUint32() * bound;
        low = product >>> 0;
      }
    }
    return Math.floor(product / 4294967296);
  };
  const uniform = (): number => (nextUint32() + 0.5) / 4294967296;
  const normal = (): number => {
    if (spare !== null) {
      const value = spare;
      spare = null;
      return value;
    }
    const radius = Math.sqrt(-2 * Math.log(uniform()));
    const angle = 2 * Math.PI * uniform();
    spare = radius * Math.sin(angle);
    return radius * Math.cos(angle);
  };
  const shuffle = (values: Float64Array): void => {
    // The state in locals for the loop, and the generator's step written out again here: a
    // closure's captured variables are slower to update, and the shuffle is the hot loop of
    // every permutation reference (measured: about a third of a check's time).
    if (values.length > SMALL_BOUND) throw new Error("shuffle: at most 2^21 values");
    let a = s0;
    let b = s1;
    let c = s2;
    let d = s3;
    for (let i = values.length - 1; i > 0; i--) {
      const bound = i + 1;
      let j: number;
      for (;;) {
        const x = Math.imul(rotl(Math.imul(b, 5), 7), 9) >>> 0;
        const t = b << 9;
        c ^= a;
        d ^= b;
        b ^= c;
        a ^= d;
        c ^= t;
        d = rotl(d, 11);
        // Lemire's test: a low part of at least `bound` is always accepted; below it, only
        // from the threshold 2^32 mod bound up.
        const product = x * bound;
        const low = product >>> 0;
        if (low >= bound || low >= (4294967296 - bound) % bound) {
          j = Math.floor(product / 4294967296);
          break;
        }
      }
      const v = values[i] as number;
      values[i] = values[j] as number;
      values[j] = v;
    }
    s0 = a;
    s1 = b;
    s2 = c;
    s3 = d;
  };
  return { nextUint32, below, uniform, normal, shuffle };
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

/**
 * High-precision evaluation with decimal.js (a general-purpose arbitrary-precision library) of
 * the published definitions, used as the yardstick for what double-precision inputs allow, and the
 * log relative error score of the NIST StRD (McCullough 1998, Am. Stat. 52:358–366).
 */
import Decimal from "decimal.js";

/** 60 significant digits: far beyond the 17 a double carries. */
export const Exact = Decimal.clone({ precision: 60, rounding: Decimal.ROUND_HALF_EVEN });
export type ExactNumber = InstanceType<typeof Exact>;

/**
 * The exact value of a double as a decimal (every finite double is a dyadic rational
 * m·2^e, which has a finite decimal expansion of at most ~770 digits; the StRD values need < 60).
 */
export function exactOfDouble(x: number): ExactNumber {
  if (!Number.isFinite(x)) throw new Error(`exactOfDouble: ${x} is not finite`);
  if (x === 0) return new Exact(0);
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  const bits = view.getBigUint64(0);
  const sign = bits >> 63n === 1n ? -1 : 1;
  const biased = Number((bits >> 52n) & 0x7ffn);
  const fraction = bits & ((1n << 52n) - 1n);
  const mantissa = biased === 0 ? fraction : fraction | (1n << 52n);
  const exponent = (biased === 0 ? 1 : biased) - 1075;
  const value = new Exact(mantissa.toString()).times(new Exact(2).pow(exponent));
  return sign < 0 ? value.negated() : value;
}

export interface ExactStatistics {
  readonly mean: ExactNumber;
  /** Sample standard deviation, denominator n − 1 (as NIST certifies it). */
  readonly sd: ExactNumber;
  /** Lag-1 autocorrelation Σ_{t=2..n} d_t d_{t−1} / Σ d_t² (NIST StRD definition). */
  readonly r1: ExactNumber;
}

/**
 * Mean, sample sd and lag-1 autocorrelation evaluated in 60-digit arithmetic from the published
 * definitions (NIST StRD univariate certification method, itl.nist.gov/div898/strd/univ/certmethdef).
 */
export function exactStatistics(values: readonly ExactNumber[]): ExactStatistics {
  const n = values.length;
  const mean = values.reduce((sum, x) => sum.plus(x), new Exact(0)).dividedBy(n);
  const d = values.map((x) => x.minus(mean));
  const c0 = d.reduce((sum, v) => sum.plus(v.times(v)), new Exact(0));
  let c1 = new Exact(0);
  for (let t = 1; t < n; t++) c1 = c1.plus((d[t] as ExactNumber).times(d[t - 1] as ExactNumber));
  return { mean, sd: c0.dividedBy(n - 1).sqrt(), r1: c1.dividedBy(c0) };
}

/** Exact r_0..r_K of the biased estimator (Box, Jenkins & Reinsel; NIST e-Handbook §1.3.5.12). */
export function exactAutocorrelations(
  values: readonly ExactNumber[],
  maxLag: number,
): ExactNumber[] {
  const n = values.length;
  const mean = values.reduce((sum, x) => sum.plus(x), new Exact(0)).dividedBy(n);
  const d = values.map((x) => x.minus(mean));
  const lagSum = (k: number) => {
    let s = new Exact(0);
    for (let t = k; t < n; t++) s = s.plus((d[t] as ExactNumber).times(d[t - k] as ExactNumber));
    return s;
  };
  const c0 = lagSum(0);
  const r: ExactNumber[] = [];
  for (let k = 0; k <= maxLag; k++) r.push(lagSum(k).dividedBy(c0));
  return r;
}

/** The LRE cap: the certified values carry 15 significant digits. */
export const LRE_CAP = 15;

/**
 * Log relative error −log10(|computed − reference| / |reference|), capped at 15 (an exact match
 * scores 15); for a reference of 0 the absolute error −log10|computed| is used instead.
 * Convention of the NIST StRD scoring (McCullough 1998, Am. Stat. 52:358–366).
 */
export function logRelativeError(
  computed: ExactNumber | number,
  reference: ExactNumber | string,
): number {
  const c = typeof computed === "number" ? exactOfDouble(computed) : computed;
  const ref = typeof reference === "string" ? new Exact(reference) : reference;
  const error = c.minus(ref).abs();
  if (error.isZero()) return LRE_CAP;
  const scaled = ref.isZero() ? error : error.dividedBy(ref.abs());
  const lre = -scaled.log(10).toNumber();
  return Math.max(0, Math.min(LRE_CAP, lre));
}

/**
 * The rolling check: the Ljung–Box joint-test p of lags 1..K (portmanteau.ts; Ljung & Box 1978,
 * Biometrika 65:297–303) for every window of `window` consecutive positions, reported at the
 * window's last position, every `step` positions. A model that was fine for two years and broke in
 * the third shows as p falling from a date on.
 *
 * Each window is its own series: its own mean, n = the values present in it, and each lag sum over
 * the pairs present in it, exactly as the lag table would compute it from scratch. The sums are
 * moved with the window instead of recomputed: with y_t the values less a shift μ₀ (0 at gaps) and
 * p_t the presence mask, the window keeps m = Σp, Σy, Σy² and, per lag k, Σ y_t p_{t−k},
 * Σ p_t y_{t−k}, Σ y_t y_{t−k} and Σ p_t p_{t−k}; then with the window mean μ,
 *   Σ (y_t − μ)(y_{t−k} − μ) = Σ y_t y_{t−k} − μ(Σ y_t p_{t−k} + Σ p_t y_{t−k}) + μ² Σ p_t p_{t−k}.
 * To keep that expansion accurate the shift μ₀ is reset to the current window's mean and the sums
 * recomputed every `window` positions (so rounding never accumulates over more than one window),
 * and also whenever a window's c₀ falls below 1e-4 of its sum of squares about μ₀ (its mean has
 * moved more than 100 standard deviations from μ₀, as after a level shift); a window still that
 * degenerate after re-centring is computed two-pass from scratch (autocorrelation.ts), and is NaN if
 * constant. Cost O(n·K) (amortised: one recomputation per `window` positions, plus one per such
 * jump), plus one χ² upper tail per window reported.
 *
 * NaN: before the first full window, between steps, and for a window with fewer than max(3, K + 1) values
 * or a constant one.
 */
import { autocorrelation } from "./autocorrelation";
import { defaultMaxLag } from "./defaultLags";
import { isEcholotError, requireWholeNumber, tooShort, type ParameterName } from "./errors";
import { jointTest } from "./portmanteau";
import type { Series } from "./types";

export interface RollingOptions {
  /** Positions per window (rows, gaps included). */
  readonly window: number;
  /** K; default min(10, ⌊window/5⌋). */
  readonly lags?: number | null;
  /** Report every `step` positions from the first full window on; default 1. */
  readonly step?: number | null;
}

export interface RollingCheck {
  readonly window: number;
  readonly lags: number;
  readonly step: number;
  /** Joint-test p at each position of the series (index = position); NaN where none. */
  readonly p: Float64Array;
}

/**
 * The sliding expansion is used while the window's c₀ is at least this share of its sum of
 * squares about the shift (the mean within 100 standard deviations of the shift): the rounding
 * of the sums, relative to c₀, then stays below about 1e4·eps·√window.
 */
const CANCELLATION_LIMIT = 1e-4;

function resolveWhole(
  name: ParameterName,
  value: number,
  lo: number,
  hi: number,
  what: string,
): number {
  return requireWholeNumber(
    name,
    value,
    lo,
    hi,
    () => `${name} must be a whole number from ${lo} to ${hi} ${what} (got ${value})`,
  );
}

export function rollingCheck(series: Series, options: RollingOptions): RollingCheck {
  const { values, present } = series;
  const length = values.length;
  if (length < 3) {
    tooShort(`a rolling check needs a series of at least 3 rows; this one spans ${length}`);
  }
  const window = resolveWhole(
    "window",
    options.window,
    3,
    length,
    `(rows per window, at most the ${length} rows the series spans)`,
  );
  const K =
    options.lags === null || options.lags === undefined
      ? defaultMaxLag(window, null)
      : resolveWhole("lags", options.lags, 1, window - 1, `(fewer than the window of ${window})`);
  const step =
    options.step === null || options.step === undefined
      ? 1
      : resolveWhole("step", options.step, 1, length, `(rows between reported windows)`);

  const p = new Float64Array(length).fill(NaN);
  const sums = new WindowSums(values, present, K);
  const correlation = new Float64Array(K + 1);
  for (let end = window - 1; end < length; end++) {
    const start = end - window + 1;
    if (end === window - 1 || (end - (window - 1)) % window === 0) sums.recompute(start, end);
    else sums.slide(start, end);
    if ((end - (window - 1)) % step !== 0) continue;
    if (!(sums.m >= Math.max(3, K + 1))) continue;
    if (!sums.correlations(correlation)) {
      // The window's mean has moved far from the shift (or the window is nearly constant):
      // re-centre on this window, and if it is still degenerate, decide exactly.
      sums.recompute(start, end);
      if (!sums.correlations(correlation)) {
        if (!exactCorrelations(series, start, end, K, correlation)) continue;
      }
    }
    p[end] = jointTest({ kind: "ljung-box", n: sums.m, correlation, fittedParams: 0 }).p;
  }
  return { window, lags: K, step, p };
}

/** The running sums of one window, about a shift μ₀. */
class WindowSums {
  m = 0;
  private shift = 0;
  private s1 = 0;
  private s2 = 0;
  private readonly laterSum: Float64Array;
  private readonly earlierSum: Float64Array;
  private readonly productSum: Float64Array;
  private readonly pairCount: Float64Array;

  constructor(
    private readonly values: Float64Array,
    private readonly present: Uint8Array,
    private readonly maxLag: number,
  ) {
    this.laterSum = new Float64Array(maxLag + 1);
    this.earlierSum = new Float64Array(maxLag + 1);
    this.productSum = new Float64Array(maxLag + 1);
    this.pairCount = new Float64Array(maxLag + 1);
  }

  private y(t: number): number {
    return this.present[t] === 1 ? (this.values[t] as number) - this.shift : 0;
  }

  /** Sums of [start, end] from scratch, about the mean of the window's values. */
  recompute(start: number, end: number): void {
    let count = 0;
    let total = 0;
    for (let t = start; t <= end; t++) {
      if (this.present[t] === 1) {
        count++;
        total += this.values[t] as number;
      }
    }
    this.shift = count > 0 ? total / count : 0;
    this.m = 0;
    this.s1 = 0;
    this.s2 = 0;
    this.laterSum.fill(0);
    this.earlierSum.fill(0);
    this.productSum.fill(0);
    this.pairCount.fill(0);
    for (let t = start; t <= end; t++) {
      this.addValue(t);
      for (let k = 1; k <= this.maxLag && t - k >= start; k++) this.addPair(t, t - k, 1);
    }
  }

  /** From [start − 1, end − 1] to [start, end]. */
  slide(start: number, end: number): void {
    const leaving = start - 1;
    this.removeValue(leaving);
    for (let k = 1; k <= this.maxLag; k++) this.addPair(leaving + k, leaving, -1);
    this.addValue(end);
    for (let k = 1; k <= this.maxLag; k++) this.addPair(end, end - k, 1);
  }

  private addValue(t: number): void {
    const y = this.y(t);
    this.m += this.present[t] as number;
    this.s1 += y;
    this.s2 += y * y;
  }

  private removeValue(t: number): void {
    const y = this.y(t);
    this.m -= this.present[t] as number;
    this.s1 -= y;
    this.s2 -= y * y;
  }

  /** Adds (sign 1) or removes (sign −1) the pair (later, earlier) at lag later − earlier. */
  private addPair(later: number, earlier: number, sign: 1 | -1): void {
    const k = later - earlier;
    const yl = this.y(later);
    const ye = this.y(earlier);
    const pl = this.present[later] as number;
    const pe = this.present[earlier] as number;
    this.laterSum[k] = (this.laterSum[k] as number) + sign * yl * pe;
    this.earlierSum[k] = (this.earlierSum[k] as number) + sign * pl * ye;
    this.productSum[k] = (this.productSum[k] as number) + sign * yl * ye;
    this.pairCount[k] = (this.pairCount[k] as number) + sign * pl * pe;
  }

  /** r_0..r_K of the window into `out`; false when cancellation makes the expansion unsafe. */
  correlations(out: Float64Array): boolean {
    const mean = this.s1 / this.m;
    const c0 = this.s2 - this.s1 * mean;
    if (!(c0 > CANCELLATION_LIMIT * this.s2)) return false;
    out[0] = 1;
    for (let k = 1; k <= this.maxLag; k++) {
      const pairs = this.pairCount[k] as number;
      const numerator =
        (this.productSum[k] as number) -
        mean * ((this.laterSum[k] as number) + (this.earlierSum[k] as number)) +
        mean * mean * pairs;
      out[k] = pairs > 0 ? numerator / c0 : NaN;
    }
    return true;
  }
}

/** r_0..r_K of one window, two-pass from scratch (autocorrelation.ts); false when constant. */
function exactCorrelations(
  series: Series,
  start: number,
  end: number,
  maxLag: number,
  out: Float64Array,
): boolean {
  const present = series.present.subarray(start, end + 1);
  let count = 0;
  for (let t = 0; t < present.length; t++) count += present[t] as number;
  const windowSeries: Series = {
    values: series.values.subarray(start, end + 1),
    present,
    label: series.label,
    count,
    gaps: present.length - count,
  };
  try {
    out.set(autocorrelation(windowSeries, maxLag).correlation);
    return true;
  } catch (error) {
    if (isEcholotError(error)) return false;
    throw error;
  }
}

/**
 * Cross-correlation of two aligned series at lags −K..K, with the noise band.
 *
 *   r_xy(k) = Σ_t d^x_t d^y_{t+k} / √(c^x_0 c^y_0),
 * so a positive lag k pairs x at t with y k periods later (x leads y), a negative lag the other
 * way round; divide-by-n sums, as for the autocorrelation (Box, Jenkins & Reinsel, *Time Series
 * Analysis*, the cross-correlation function of transfer-function identification). The band is
 * ±z_{1−α/2}/√n: when the two series are independent and one of them is white noise, each
 * r_xy(k) is approximately N(0, 1/n) (same source).
 *
 * The series are paired by position (row by row) and a gap in either is a gap of the pair: means
 * and sums of squares are taken over the positions where both values exist, and each lag sums over
 * the pairs of such positions. Two series read from ranges of different sizes are refused.
 * A lag with no pair is NaN. Cost O(n·K).
 */
import { cellExtent } from "./cells";
import { centre } from "./centre";
import { normalQuantile } from "./distributions";
import { invalid, tooShort } from "./errors";
import { resolveAlpha, resolveLagCountOrDefault } from "./options";
import { seriesName } from "./seriesName";
import { CompensatedSum } from "./sums";
import type { Series } from "./types";

export interface CrossCorrelationOptions {
  /** K; default min(10, ⌊n/5⌋) with n the positions where both series have a value. */
  readonly maxLag?: number | null;
  readonly alpha?: number | null;
}

export interface CrossLag {
  /** k from −K to K: positive when x leads y. */
  readonly lag: number;
  readonly correlation: number;
  /** Pairs of positions available at this lag. */
  readonly pairs: number;
  /** Noise band half-width z_{1−α/2}/√n. */
  readonly band: number;
  /** |r_k| beyond the band. */
  readonly crossesBand: boolean;
}

export interface CrossCorrelation {
  readonly labelX: string;
  readonly labelY: string;
  /** Positions where both series have a value. */
  readonly n: number;
  readonly maxLag: number;
  readonly alpha: number;
  readonly meanX: number;
  readonly meanY: number;
  readonly rows: readonly CrossLag[];
}

export function crossCorrelation(
  x: Series,
  y: Series,
  options: CrossCorrelationOptions = {},
): CrossCorrelation {
  const ex = cellExtent(x);
  const ey = cellExtent(y);
  if (ex.cells !== ey.cells) {
    invalid(
      `${seriesName(x.label, "message", { argument: "x" })} covers ${ex.cells} rows and ${seriesName(y.label, "message", { argument: "y" })} ${ey.cells}: give two ranges of the same size, one row per period in both`,
    );
  }
  // The pair's positions, in cell coordinates, from the later start to the earlier end.
  const from = Math.max(ex.start, ey.start);
  const to = Math.min(ex.start + x.values.length, ey.start + y.values.length);
  const length = Math.max(0, to - from);
  const present = new Uint8Array(length);
  const xs = new Float64Array(length);
  const ys = new Float64Array(length);
  let n = 0;
  for (let i = 0; i < length; i++) {
    const ix = from + i - ex.start;
    const iy = from + i - ey.start;
    if (x.present[ix] === 1 && y.present[iy] === 1) {
      present[i] = 1;
      xs[i] = x.values[ix] as number;
      ys[i] = y.values[iy] as number;
      n++;
    }
  }
  if (n < 3) {
    tooShort(
      `a cross-correlation needs at least 3 periods where both series have a value; these have ${n}`,
    );
  }
  const alpha = resolveAlpha(options.alpha);
  const maxLag = resolveLagCountOrDefault("maxLag", options.maxLag, n);
  const pair = (values: Float64Array, label: string): Series => ({
    values,
    present,
    label,
    count: n,
    gaps: length - n,
  });
  const cx = centre(pair(xs, x.label));
  const cy = centre(pair(ys, y.label));
  for (const [c, s, name] of [
    [cx, x, "x"],
    [cy, y, "y"],
  ] as const) {
    if (!(c.sumSquares > 0)) {
      invalid(
        `${seriesName(s.label, "message", { argument: name })} is constant over the periods where both series have a value: its cross-correlation is undefined`,
      );
    }
  }
  const scale = Math.sqrt(cx.sumSquares) * Math.sqrt(cy.sumSquares);
  const band = normalQuantile(1 - alpha / 2) / Math.sqrt(n);
  const dx = cx.deviations;
  const dy = cy.deviations;
  const rows: CrossLag[] = [];
  for (let k = -maxLag; k <= maxLag; k++) {
    // Positive k: x at t, y at t + k; negative k: x at t + |k|, y at t.
    const shiftX = k < 0 ? -k : 0;
    const shiftY = k > 0 ? k : 0;
    const sum = new CompensatedSum();
    let pairs = 0;
    for (let t = 0; t + Math.abs(k) < length; t++) {
      sum.add((dx[t + shiftX] as number) * (dy[t + shiftY] as number));
      pairs += (present[t + shiftX] as number) & (present[t + shiftY] as number);
    }
    const correlation = pairs > 0 ? sum.value / scale : NaN;
    rows.push({ lag: k, correlation, pairs, band, crossesBand: Math.abs(correlation) > band });
  }
  return {
    labelX: x.label,
    labelY: y.label,
    n,
    maxLag,
    alpha,
    meanX: cx.mean,
    meanY: cy.mean,
    rows,
  };
}

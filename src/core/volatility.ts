/**
 * The volatility check: is the size of the deviations predictable from their recent size
 * (volatility clustering, ARCH effects)? Two tests of the squared deviations s_t = (x_t − x̄)²,
 * reported together:
 *
 * - Engle's LM test (Engle 1982, Econometrica 50:987–1007): regress s_t on a constant and
 *   s_{t−1}, …, s_{t−q} by least squares over the usable rows and take LM = T·R², referred to χ²_q.
 *   T is the number of rows used, n − q for a series without gaps (some texts use n instead;
 *   Echolot uses T, the rows actually in the regression). With gaps a row is usable only when
 *   s_t and all q lagged squares exist, so T can be smaller. R² is the explained over the total
 *   sum of squares about the mean, both taken from the QR rotation (leastSquares.ts).
 * - McLeod–Li (McLeod & Li 1983, J. Time Ser. Anal. 4:269–273): Ljung–Box on the squared
 *   deviations over the same q lags — the lag table's testKind "squares" (squares.ts and
 *   portmanteau.ts compute it; nothing is repeated here).
 * Default q is the lag table's default, min(10, ⌊n/5⌋), so this check and the squared-deviations
 * view agree. Cost O(n·q²) for the regression.
 */
import { centre } from "./centre";
import { chiSquareUpperTail } from "./distributions";
import { invalid, isEcholotError, tooShort } from "./errors";
import { seriesName } from "./seriesName";
import { leastSquares, type LeastSquaresFit } from "./leastSquares";
import { resolveAlpha, resolveLagCountOrDefault, requireValues } from "./options";
import { cumulativeJointTest, jointTestAt } from "./portmanteau";
import { squaredDeviationCorrelation } from "./squares";
import { CompensatedSum } from "./sums";
import type { Series } from "./types";

export interface VolatilityOptions {
  /** q, the number of lagged squares; default min(10, ⌊n/5⌋). */
  readonly lags?: number | null;
  /** Level at which `flagged` is set; default 0.05. */
  readonly alpha?: number | null;
}

export interface VolatilityCheck {
  readonly label: string;
  /** Values present. */
  readonly n: number;
  /** q. */
  readonly lags: number;
  readonly alpha: number;
  /** T, the regression rows used (n − q without gaps). */
  readonly rows: number;
  readonly rSquared: number;
  /** Engle's LM = T·R². */
  readonly lm: number;
  readonly df: number;
  readonly p: number;
  /** McLeod–Li Q over q lags and its p (χ²_q). */
  readonly mcleodLiQ: number;
  readonly mcleodLiP: number;
  /** Engle's LM rejects constant volatility at alpha. */
  readonly flagged: boolean;
}

export function volatilityCheck(series: Series, options: VolatilityOptions = {}): VolatilityCheck {
  requireValues(series, 3, "the volatility check");
  const n = series.count;
  const alpha = resolveAlpha(options.alpha);
  const q = resolveLagCountOrDefault("lags", options.lags, n);
  // One array of deviations for both tests: Engle's regression reads it, then the squares are
  // written over it (the check then needs one array of the series' length, not three).
  const { deviations } = centre(series);
  const { rows, rSquared } = engleRegression(series, q, deviations);
  const lm = rows * rSquared;
  const p = chiSquareUpperTail(lm, q);

  const squares = squaredDeviationCorrelation(series, q, deviations);
  const mcleodLi = jointTestAt(
    "squares",
    cumulativeJointTest({
      kind: "squares",
      n: squares.n,
      correlation: squares.correlation,
      fittedParams: 0,
    }),
  );
  return {
    label: series.label,
    n,
    lags: q,
    alpha,
    rows,
    rSquared,
    lm,
    df: q,
    p,
    mcleodLiQ: mcleodLi.q,
    mcleodLiP: mcleodLi.p,
    flagged: p < alpha,
  };
}

/** The LM regression of s_t on 1, s_{t−1..t−q}: its usable rows T and R². */
/** Rows per block of the regression: its memory stays O(block·q), whatever the length. */
const BLOCK_ROWS = 8192;

/**
 * Engle's regression fitted block by block (a stacked Householder update: each block's rows
 * are fitted together with the R and rotated response carried from the blocks before, Golub &
 * Van Loan §5.3), so a series of any length needs memory for one block only. The residual sums
 * of squares of the blocks add up: their rotated parts are orthogonal to what is carried.
 */
function engleRegression(
  series: Series,
  q: number,
  deviations: Float64Array,
): { rows: number; rSquared: number } {
  const { present } = series;
  const length = present.length;
  const columns = q + 1;
  const usable = (t: number) => {
    for (let j = 0; j <= q; j++) if (present[t - j] !== 1) return false;
    return true;
  };
  let rows = 0;
  for (let t = q; t < length; t++) if (usable(t)) rows++;
  if (rows < columns + 1) {
    tooShort(
      `Engle's LM test with ${q} lag${q === 1 ? "" : "s"} needs at least ${columns + 1} rows with the value and its ${q} predecessors present; the series has ${rows}: use fewer lags`,
    );
  }
  // No block is taller than the usable rows: a short series allocates for its own rows only.
  const capacity = columns + Math.min(BLOCK_ROWS, rows);
  const design = new Float64Array(capacity * columns);
  const response = new Float64Array(capacity);
  let triangle: Float64Array | undefined;
  const rotated = new Float64Array(columns);
  const residual = new CompensatedSum();
  let t = q;
  while (t < length) {
    // The carried R and c first, then the next block's usable rows.
    const carried = triangle === undefined ? 0 : columns;
    const block: number[] = [];
    for (; t < length && block.length < BLOCK_ROWS; t++) if (usable(t)) block.push(t);
    if (block.length === 0) break;
    const height = carried + block.length;
    for (let j = 0; j < columns; j++) {
      for (let i = 0; i < carried; i++) {
        design[j * height + i] =
          i <= j ? ((triangle as Float64Array)[j * columns + i] as number) : 0;
      }
    }
    for (let i = 0; i < carried; i++) response[i] = rotated[i] as number;
    block.forEach((row, b) => {
      const i = carried + b;
      const d = deviations[row] as number;
      response[i] = d * d;
      design[i] = 1;
      for (let j = 1; j <= q; j++) {
        const lagged = deviations[row - j] as number;
        design[j * height + i] = lagged * lagged;
      }
    });
    let fit: LeastSquaresFit;
    try {
      fit = leastSquares(
        design.subarray(0, height * columns),
        height,
        columns,
        response.subarray(0, height),
      );
    } catch (error) {
      if (!isEcholotError(error)) throw error;
      invalid(
        `the squared deviations of ${seriesName(series.label)} do not vary enough over the usable rows for Engle's LM test (they are constant or repeat exactly); use fewer lags or check the data`,
      );
    }
    triangle = fit.triangle;
    rotated.set(fit.rotatedResponse.subarray(0, columns));
    residual.add(fit.residualSumSquares);
  }
  const explained = new CompensatedSum();
  for (let i = 1; i < columns; i++) explained.add((rotated[i] as number) ** 2);
  const total = new CompensatedSum();
  total.add(explained.value);
  total.add(residual.value);
  if (!(total.value > 0)) {
    invalid(
      `the squared deviations of ${seriesName(series.label)} are constant, so their dependence is undefined`,
    );
  }
  return { rows, rSquared: explained.value / total.value };
}

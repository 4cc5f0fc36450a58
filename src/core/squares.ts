/**
 * Autocorrelation of the squared deviations s_t = (x_t − x̄)², the input of the McLeod–Li test and
 * of the pane's "squared deviations" view (McLeod & Li 1983, J. Time Ser. Anal. 4:269–273). The
 * squares keep the series' gaps. O(n·K).
 */
import { autocorrelation, type Autocorrelation } from "./autocorrelation";
import { centre } from "./centre";
import { invalid, isEcholotError } from "./errors";
import { seriesName } from "./seriesName";
import type { Series } from "./types";

/**
 * The squares are written over the deviations (a fresh array of centre's, or the caller's, given
 * up), and later centred where they lie, so one array of the series' length serves throughout.
 */
function squaredDeviationSeries(series: Series, deviations?: Float64Array): Series {
  const values = deviations ?? centre(series).deviations;
  for (let t = 0; t < values.length; t++) {
    const d = values[t] as number;
    values[t] = series.present[t] === 1 ? d * d : NaN;
  }
  return { ...series, values };
}

/**
 * `deviations`: the series' deviations from `centre(series)`, when the caller has them and gives
 * them up (they are overwritten); otherwise they are computed here.
 */
export function squaredDeviationCorrelation(
  series: Series,
  maxLag: number,
  deviations?: Float64Array,
): Autocorrelation {
  const squares = squaredDeviationSeries(series, deviations);
  try {
    return autocorrelation(squares, maxLag, squares.values);
  } catch (error) {
    // Only the autocorrelation's refusal (constant squares) is ours to reword; anything else is a bug.
    if (!isEcholotError(error)) throw error;
    invalid(
      `the squared deviations of ${seriesName(series.label)} are constant (every value is equally far from the mean), so their autocorrelation is undefined`,
    );
  }
}

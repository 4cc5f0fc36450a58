/**
 * Linear least squares by Householder QR: minimise ‖y − Xβ‖ for a tall design X (rows ≥ columns).
 *
 * Each column j is reflected onto the axis by H_j = I − 2vvᵀ/(vᵀv), so X = QR with R upper
 * triangular, and the same reflections turn y into c = Qᵀy. Then Rβ = c[0..p) by back
 * substitution and the residual sum of squares is Σ_{i≥p} c_i², a sum of squares rather than a
 * difference, so no digits are lost to cancellation. With an intercept as the first column,
 * Σ_{0<i<p} c_i² is the explained sum of squares about the mean (the intercept's reflection takes
 * the mean out). Golub & Van Loan, *Matrix Computations*, §5.3 (Householder least squares).
 * A column whose remaining norm is below 1e-12 of its original norm makes the design rank
 * deficient and is refused. Cost O(rows·columns²).
 */
import { invalid } from "./errors";
import { CompensatedSum } from "./sums";

export interface LeastSquaresFit {
  /** β, one per column. */
  readonly coefficients: Float64Array;
  /** c = Qᵀy: the response in the rotated coordinates. */
  readonly rotatedResponse: Float64Array;
  /** Σ_{i≥columns} c_i². */
  readonly residualSumSquares: number;
  /**
   * R, columns × columns upper triangular, column-major (R_jk at `triangle[k * columns + j]`,
   * j ≤ k): with `rotatedResponse[0..columns)` it stands for every row fitted so far, so a long
   * regression can be fitted block by block (stack R and c over the next block's rows).
   */
  readonly triangle: Float64Array;
}

const RANK_TOLERANCE = 1e-12;

function columnNorm(a: Float64Array, offset: number, from: number, to: number): number {
  let scale = 0;
  for (let i = from; i < to; i++) scale = Math.max(scale, Math.abs(a[offset + i] as number));
  if (scale === 0) return 0;
  let sum = 0;
  for (let i = from; i < to; i++) {
    const v = (a[offset + i] as number) / scale;
    sum += v * v;
  }
  return scale * Math.sqrt(sum);
}

/**
 * `design` is column-major: entry (i, j) at `design[j * rows + i]`. Neither input is modified.
 */
export function leastSquares(
  design: ArrayLike<number>,
  rows: number,
  columns: number,
  response: ArrayLike<number>,
): LeastSquaresFit {
  if (!(rows >= columns && columns >= 1)) {
    invalid(`least squares needs at least as many rows as columns (got ${rows} × ${columns})`);
  }
  const a = Float64Array.from(design);
  const c = Float64Array.from(response);
  for (let j = 0; j < columns; j++) {
    const offset = j * rows;
    const original = columnNorm(a, offset, 0, rows);
    const norm = columnNorm(a, offset, j, rows);
    if (!(norm > RANK_TOLERANCE * original)) {
      invalid(`column ${j + 1} of the regression is a combination of the others`);
    }
    // v = x − αe₁ with α = −sign(x₀)‖x‖ avoids cancellation in v₀.
    const head = a[offset + j] as number;
    const alpha = head >= 0 ? -norm : norm;
    a[offset + j] = head - alpha;
    let vv = 0;
    for (let i = j; i < rows; i++) vv += (a[offset + i] as number) ** 2;
    const reflect = (target: Float64Array, targetOffset: number) => {
      let dot = 0;
      for (let i = j; i < rows; i++)
        dot += (a[offset + i] as number) * (target[targetOffset + i] as number);
      const factor = (2 * dot) / vv;
      for (let i = j; i < rows; i++) {
        target[targetOffset + i] =
          (target[targetOffset + i] as number) - factor * (a[offset + i] as number);
      }
    };
    for (let k = j + 1; k < columns; k++) reflect(a, k * rows);
    reflect(c, 0);
    // Store R's diagonal in place of the spent reflector head (the rest of v is not needed again).
    a[offset + j] = alpha;
  }

  const coefficients = new Float64Array(columns);
  for (let j = columns - 1; j >= 0; j--) {
    let s = c[j] as number;
    for (let k = j + 1; k < columns; k++)
      s -= (a[k * rows + j] as number) * (coefficients[k] as number);
    coefficients[j] = s / (a[j * rows + j] as number);
  }
  const residual = new CompensatedSum();
  for (let i = columns; i < rows; i++) residual.add((c[i] as number) ** 2);
  const triangle = new Float64Array(columns * columns);
  for (let k = 0; k < columns; k++) {
    for (let j = 0; j <= k; j++) triangle[k * columns + j] = a[k * rows + j] as number;
  }
  return { coefficients, rotatedResponse: c, residualSumSquares: residual.value, triangle };
}

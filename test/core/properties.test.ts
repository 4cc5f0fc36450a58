/**
 * Invariants that hold for every input (fast-check, 500 runs each, fixed seed): what the
 * definitions of the biased autocorrelation estimator, the Durbin–Levinson recursion and the
 * portmanteau tests promise for any series.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  autocorrelation,
  EcholotError,
  lagTable,
  seriesFromNumbers,
  seriesFromValues,
  TEST_KINDS,
  type Series,
} from "../../src/core";

const RUNS = { numRuns: 500, seed: 20_260_601 } as const;
const EPS = Number.EPSILON;

function isConstant(x: readonly number[]): boolean {
  return x.every((v) => v === x[0]);
}

/**
 * Finite values: eighths of integers (exact, well spread) or doubles of spreadsheet-like size,
 * 0 or 1e-6 ≤ |v| ≤ 1e3. Far smaller magnitudes are left out on purpose: below about 1e-77 the
 * squares d_t²·d_{t−k}² of the robust variance underflow, which no property here is about.
 */
const value = fc.oneof(
  fc.integer({ min: -1000, max: 1000 }).map((i) => i / 8),
  fc
    .double({ min: -1e3, max: 1e3, noNaN: true, noDefaultInfinity: true })
    .map((v) => (Math.abs(v) < 1e-6 ? 0 : v)),
);

/** Gap-free, non-constant series of 3 to 64 values. */
const numbers = fc.array(value, { minLength: 3, maxLength: 64 }).filter((x) => !isConstant(x));

function standardDeviation(x: readonly number[]): number {
  const mean = x.reduce((s, v) => s + v, 0) / x.length;
  return Math.sqrt(x.reduce((s, v) => s + (v - mean) ** 2, 0) / x.length);
}

/** Every lag the series allows: r_0..r_{n−1}. */
function allCorrelations(series: Series): Float64Array {
  return autocorrelation(series, series.values.length - 1).correlation;
}

/**
 * Cholesky factorisation for a positive semi-definite matrix: a pivot within ±tol of zero is a
 * zero eigen-direction (its column is dropped); a pivot below −tol proves the matrix indefinite.
 * Returns the smallest pivot relative to the tolerance rule.
 */
function semidefiniteCholesky(matrix: number[][], tol: number): { ok: boolean; minPivot: number } {
  const m = matrix.length;
  const lower = matrix.map(() => new Float64Array(m));
  let minPivot = Infinity;
  for (let j = 0; j < m; j++) {
    let pivot = (matrix[j] as number[])[j] as number;
    for (let k = 0; k < j; k++) pivot -= ((lower[j] as Float64Array)[k] as number) ** 2;
    minPivot = Math.min(minPivot, pivot);
    if (pivot < -tol) return { ok: false, minPivot };
    if (pivot <= tol) continue;
    const root = Math.sqrt(pivot);
    (lower[j] as Float64Array)[j] = root;
    for (let i = j + 1; i < m; i++) {
      let s = (matrix[i] as number[])[j] as number;
      for (let k = 0; k < j; k++) {
        s -= ((lower[i] as Float64Array)[k] as number) * ((lower[j] as Float64Array)[k] as number);
      }
      (lower[i] as Float64Array)[j] = s / root;
    }
  }
  return { ok: true, minPivot };
}

describe("autocorrelation(series, K) properties (biased estimator, Box, Jenkins & Reinsel)", () => {
  it("autocorrelation(series) gives r_0 = 1 for every series", () => {
    fc.assert(
      fc.property(numbers, (x) => {
        expect(allCorrelations(seriesFromNumbers(x))[0]).toBe(1);
      }),
      RUNS,
    );
  });

  it("autocorrelation(series) keeps |r_k| ≤ 1 at every lag", () => {
    // Cauchy–Schwarz on the biased estimator; 1 + 4·eps allows the last rounding.
    fc.assert(
      fc.property(numbers, (x) => {
        const r = allCorrelations(seriesFromNumbers(x));
        for (let k = 1; k < r.length; k++) {
          expect(Math.abs(r[k] as number), `|r_${k}| of ${JSON.stringify(x)}`).toBeLessThanOrEqual(
            1 + 4 * EPS,
          );
        }
      }),
      RUNS,
    );
  });

  it("autocorrelation(a + b·x) equals autocorrelation(x) for any b ≠ 0", () => {
    const scale = fc.tuple(fc.double({ min: 0.01, max: 100, noNaN: true }), fc.boolean());
    fc.assert(
      fc.property(
        numbers,
        fc.double({ min: -1e3, max: 1e3, noNaN: true }),
        scale,
        (x, a, [size, negative]) => {
          const b = negative ? -size : size;
          const y = x.map((v) => a + b * v);
          fc.pre(!isConstant(y));
          const rx = allCorrelations(seriesFromNumbers(x));
          const ry = allCorrelations(seriesFromNumbers(y));
          // Each transformed value carries a rounding error up to δ = eps·(|a|/|b| + |x|) in x's
          // units; a perturbation δ per value moves r_k by at most about 4·√n·δ/sd(x).
          const maxAbs = x.reduce((m, v) => Math.max(m, Math.abs(v)), 0);
          const delta = EPS * (Math.abs(a) / Math.abs(b) + maxAbs);
          const tol = 1e-12 + (8 * Math.sqrt(x.length) * delta) / standardDeviation(x);
          for (let k = 1; k < rx.length; k++) {
            const difference = Math.abs((rx[k] as number) - (ry[k] as number));
            expect(
              difference,
              `r_${k}: a ${a}, b ${b}, x ${JSON.stringify(x)}; tolerance ${tol}`,
            ).toBeLessThanOrEqual(tol);
          }
        },
      ),
      RUNS,
    );
  });

  it("autocorrelation(reversed series) equals autocorrelation(series)", () => {
    // Σ d_t d_{t−k} runs over the same pairs backwards; only the summation order changes.
    fc.assert(
      fc.property(numbers, (x) => {
        const forward = allCorrelations(seriesFromNumbers(x));
        const backward = allCorrelations(seriesFromNumbers([...x].reverse()));
        for (let k = 1; k < forward.length; k++) {
          const difference = Math.abs((forward[k] as number) - (backward[k] as number));
          expect(
            difference,
            `r_${k} of ${JSON.stringify(x)} forwards and backwards; tolerance 1e-12`,
          ).toBeLessThanOrEqual(1e-12);
        }
      }),
      RUNS,
    );
  });

  it("autocorrelation(series) gives a positive semi-definite autocovariance Toeplitz matrix (n ≤ 64)", () => {
    // The biased estimator's Toeplitz matrix [γ̂_|i−j|] is Γ = DᵀD/n for a banded D: PSD.
    // Tolerance: pivots down to −n·64·eps·γ̂_0 are rounding, below that a real failure.
    fc.assert(
      fc.property(numbers, (x) => {
        const n = x.length;
        const gamma = autocorrelation(seriesFromNumbers(x), n - 1).autocovariance;
        const matrix = Array.from({ length: n }, (_, i) =>
          Array.from({ length: n }, (_, j) => gamma[Math.abs(i - j)] as number),
        );
        const tol = n * 64 * EPS * (gamma[0] as number);
        const { ok, minPivot } = semidefiniteCholesky(matrix, tol);
        expect(ok, `Toeplitz of ${JSON.stringify(x)}: pivot ${minPivot} below −${tol}`).toBe(true);
      }),
      RUNS,
    );
  });
});

describe("lagTable(series) properties", () => {
  const withLags = numbers.chain((x) =>
    fc.tuple(fc.constant(x), fc.integer({ min: 1, max: x.length - 1 })),
  );

  it("lagTable(series, testKind) gives Q ≥ 0, non-decreasing in k, for every test kind", () => {
    fc.assert(
      fc.property(withLags, fc.constantFrom(...TEST_KINDS), ([x, maxLag], testKind) => {
        let table;
        try {
          table = lagTable(seriesFromNumbers(x), { maxLag, testKind });
        } catch (error) {
          // Squared deviations can be constant (x = ±c around its mean): refused, not a Q.
          expect(testKind).toBe("squares");
          expect(error).toBeInstanceOf(EcholotError);
          return;
        }
        let previous = 0;
        for (const row of table.rows) {
          expect(
            row.jointQ,
            `${testKind} Q at lag ${row.lag} of ${JSON.stringify(x)}`,
          ).toBeGreaterThanOrEqual(0);
          // A running compensated sum of non-negative terms; 4·eps allows its last rounding.
          expect(row.jointQ, `${testKind} Q decreases at lag ${row.lag}`).toBeGreaterThanOrEqual(
            previous * (1 - 4 * EPS),
          );
          previous = row.jointQ;
        }
      }),
      RUNS,
    );
  });

  it("lagTable(series) gives every p-value in [0, 1]", () => {
    const inUnit = (p: number) => p >= 0 && p <= 1;
    fc.assert(
      fc.property(
        withLags,
        fc.constantFrom(...TEST_KINDS),
        fc.constantFrom("noise", "bartlett", "robust"),
        ([x, maxLag], testKind, bandKind) => {
          let table;
          try {
            table = lagTable(seriesFromNumbers(x), { maxLag, testKind, bandKind });
          } catch (error) {
            expect(testKind).toBe("squares");
            expect(error).toBeInstanceOf(EcholotError);
            return;
          }
          for (const row of table.rows) {
            for (const [name, p] of [
              ["pLag", row.pLag],
              ["pSidak", row.pSidak],
              ["jointP", row.jointP],
            ] as const) {
              // A robust se of 0 (no squared pair) makes z and its p undefined: NaN, never out of range.
              if (bandKind === "robust" && name !== "jointP" && Number.isNaN(p)) continue;
              expect(
                inUnit(p),
                `${name} = ${p} at lag ${row.lag}, ${testKind}/${bandKind}, ${JSON.stringify(x)}`,
              ).toBe(true);
            }
          }
          expect(inUnit(table.joint.p)).toBe(true);
          expect(inUnit(table.falseAlarm.chance)).toBe(true);
        },
      ),
      RUNS,
    );
  });

  it("lagTable(series) gives the partial at lag 1 equal to r_1", () => {
    // Durbin–Levinson: φ_11 = r_1.
    fc.assert(
      fc.property(withLags, ([x, maxLag]) => {
        const row = lagTable(seriesFromNumbers(x), { maxLag }).rows[0];
        expect(row?.partial).toBe(row?.correlation);
      }),
      RUNS,
    );
  });

  it("lagTable(series) does not mutate its input", () => {
    fc.assert(
      fc.property(withLags, ([x, maxLag]) => {
        const list: unknown[] = [...x];
        const series = seriesFromValues(list);
        const values = Array.from(series.values);
        const present = Array.from(series.present);
        lagTable(series, { maxLag, bandKind: "robust", testKind: "robust" });
        expect(Array.from(series.values)).toEqual(values);
        expect(Array.from(series.present)).toEqual(present);
        expect(list).toEqual(x);
      }),
      RUNS,
    );
  });
});

describe("gap-aware autocorrelation against the pairwise definition", () => {
  /** Series of 3–64 cells, some of them gaps (null), with at least 3 non-constant values. */
  const withGaps = fc
    .array(
      fc.option(
        fc.integer({ min: -1000, max: 1000 }).map((i) => i / 8),
        { freq: 4, nil: null },
      ),
      {
        minLength: 3,
        maxLength: 64,
      },
    )
    .filter((cells) => {
      const present = cells.filter((c): c is number => c !== null);
      return present.length >= 3 && !isConstant(present);
    });

  /**
   * The definition, written plainly: the mean of the values present; d_t = x_t − mean where x_t
   * is present; r_k = Σ over t of d_t·d_{t−k} for the pairs where both are present, divided by
   * c0 = Σ d_t² over the values present. A lag with no such pair is undefined (NaN).
   */
  function pairwiseDefinition(cells: readonly (number | null)[], maxLag: number): number[] {
    const present = cells.filter((c): c is number => c !== null);
    const mean = present.reduce((s, v) => s + v, 0) / present.length;
    const c0 = present.reduce((s, v) => s + (v - mean) ** 2, 0);
    const r: number[] = [];
    for (let k = 0; k <= maxLag; k++) {
      let sum = 0;
      let pairs = 0;
      for (let t = k; t < cells.length; t++) {
        const now = cells[t];
        const before = cells[t - k];
        if (now === null || now === undefined || before === null || before === undefined) continue;
        sum += (now - mean) * (before - mean);
        pairs++;
      }
      r.push(pairs === 0 ? NaN : sum / c0);
    }
    return r;
  }

  it("lagTable(series with gaps) equals the pairwise definition at every lag", () => {
    fc.assert(
      fc.property(withGaps, (cells) => {
        const series = seriesFromValues(cells);
        const maxLag = series.count - 1;
        const table = lagTable(series, { maxLag });
        const expected = pairwiseDefinition(cells, maxLag);
        expect(table.n).toBe(series.count);
        for (const row of table.rows) {
          const want = expected[row.lag] as number;
          if (Number.isNaN(want)) {
            expect(
              Number.isNaN(row.correlation),
              `r_${row.lag} of ${JSON.stringify(cells)} has no pair`,
            ).toBe(true);
            continue;
          }
          const difference = Math.abs(row.correlation - want);
          expect(
            difference,
            `r_${row.lag} of ${JSON.stringify(cells)}: expected ${want}, got ${row.correlation}; tolerance 1e-12`,
          ).toBeLessThanOrEqual(1e-12);
        }
      }),
      RUNS,
    );
  });
});

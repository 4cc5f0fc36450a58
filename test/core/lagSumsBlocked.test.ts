/**
 * The fast direct path keeps its accuracy: the cache-blocked, six-lags-at-a-time lag sums and the
 * blocked centring passes against exact sums of the same doubles (decimal.js, 60 digits), at the
 * block and group edges where an index slip would show; the gap pair counts (inclusion–exclusion)
 * against counting pair by pair.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { BLOCK, centre, directLagProductSums, pairCounts, type Series } from "../../src/core";
import { seededRandom } from "../../src/sim/random";
import { Exact, exactOfDouble, type ExactNumber } from "../helpers/exact";
import { expectAtMost } from "../helpers/expectClose";

/** Unit roundoff of a double, 2^−53. */
const UNIT = 2 ** -53;

/**
 * Error bound of the blocked sum: at most m = 1.5·BLOCK terms (a short last block joins the one
 * before) are added plainly, (m − 1)·u·Σ|terms| (Higham, Accuracy and Stability of Numerical
 * Algorithms, 2nd ed., §4.2), one rounding per product, and the block totals are added with
 * Neumaier's compensation, about 2u·Σ|totals| (Neumaier 1974, ZAMM 54:39–51).
 * (1.5·BLOCK + 2)·u·Σ|a_t a_{t−k}| covers all three.
 */
const BOUND_FACTOR = (1.5 * BLOCK + 2) * UNIT;

function exactLagSums(
  a: Float64Array,
  maxLag: number,
): { sums: ExactNumber[]; magnitude: number[] } {
  const x = Array.from(a, exactOfDouble);
  const sums: ExactNumber[] = [];
  const magnitude: number[] = [];
  for (let k = 0; k <= maxLag; k++) {
    let s = new Exact(0);
    let m = 0;
    for (let t = k; t < a.length; t++) {
      s = s.plus((x[t] as ExactNumber).times(x[t - k] as ExactNumber));
      m += Math.abs((a[t] as number) * (a[t - k] as number));
    }
    sums.push(s);
    magnitude.push(m);
  }
  return { sums, magnitude };
}

describe("directLagProductSums(a, K) against exact sums of the doubles", () => {
  // Lengths at the edges of a block (BLOCK = 256) and of a merged last block (a remainder under
  // 128 joins the block before), and K at the edges of a six-lag group.
  const lengths = [1, 5, 6, 7, 255, 256, 257, 300, 383, 384, 385, 513, 640, 641];
  const lags = [0, 1, 5, 6, 7, 12, 13, 40];

  it.each(lengths)("length %i, every K in the list, data with an offset of 1e6", (length) => {
    const random = seededRandom(length);
    const a = new Float64Array(length);
    for (let t = 0; t < length; t++) a[t] = 1e6 + random.normal();
    const maxLag = lags.reduce((m, k) => Math.max(m, k), 0);
    const exact = exactLagSums(a, maxLag);
    for (const k of lags) {
      const sums = directLagProductSums(a, k);
      expect(sums.length).toBe(k + 1);
      for (let j = 0; j <= k; j++) {
        const error = Math.abs(
          new Exact(sums[j] as number).minus(exact.sums[j] as ExactNumber).toNumber(),
        );
        expectAtMost(
          error,
          BOUND_FACTOR * (exact.magnitude[j] as number),
          `length ${length}, K ${k}, lag ${j}: |direct − exact| (bound (1.5·BLOCK+2)·u·Σ|terms|)`,
        );
      }
    }
  });

  it("lags at or beyond the length sum to exactly 0; lag 0 is Σ a_t²", () => {
    const a = Float64Array.from([3, -1, 2]);
    expect(Array.from(directLagProductSums(a, 5))).toEqual([14, -5, 6, 0, 0, 0]);
  });

  it("does not mutate its input", () => {
    const a = Float64Array.from([1, 2, 3, 4, 5, 6, 7, 8, 9]);
    const copy = Float64Array.from(a);
    directLagProductSums(a, 8);
    expect(Array.from(a)).toEqual(Array.from(copy));
  });
});

describe("centre(series) with blocked passes, against exact values of the doubles", () => {
  it("mean and c₀ of 5,000 values near 1e8 with 10% gaps, within the blocked-sum bounds", () => {
    const random = seededRandom(5000);
    const length = 5000;
    const values = new Float64Array(length);
    const present = new Uint8Array(length);
    let count = 0;
    for (let t = 0; t < length; t++) {
      if (t > 0 && t < length - 1 && random.uniform() < 0.1) {
        values[t] = NaN;
      } else {
        values[t] = 1e8 + random.normal();
        present[t] = 1;
        count++;
      }
    }
    const series: Series = { values, present, label: "", count, gaps: length - count };
    const { mean, sumSquares, deviations } = centre(series);
    const kept = Array.from(values).filter((_, t) => present[t] === 1);
    const exactValues = kept.map(exactOfDouble);
    const exactMean = exactValues.reduce((s, x) => s.plus(x), new Exact(0)).dividedBy(count);
    const exactC0 = exactValues.reduce((s, x) => s.plus(x.minus(exactMean).pow(2)), new Exact(0));
    // Mean: the corrected two-pass mean is within a few u of x̄ (Chan, Golub & LeVeque 1983,
    // Am. Stat. 37:242–247); 4u is the allowance here.
    expectAtMost(
      Math.abs(new Exact(mean).minus(exactMean).dividedBy(exactMean).toNumber()),
      4 * UNIT,
      "centre mean, relative error vs exact",
    );
    // c₀: a sum of positive terms, blocked as above, plus one rounding in each d_t and d_t².
    expectAtMost(
      Math.abs(new Exact(sumSquares).minus(exactC0).dividedBy(exactC0).toNumber()),
      BOUND_FACTOR + 4 * UNIT,
      "centre c0, relative error vs exact",
    );
    for (let t = 0; t < length; t++) {
      if (present[t] === 0 && deviations[t] !== 0)
        expect.fail(`gap at ${t} has deviation ${deviations[t]}`);
    }
  });
});

/** Σ_t m_t m_{t−k}, counted pair by pair (the definition). */
function countPairs(present: Uint8Array, maxLag: number): number[] {
  const counts: number[] = [];
  for (let k = 0; k <= maxLag; k++) {
    let c = 0;
    for (let t = k; t < present.length; t++) c += present[t] === 1 && present[t - k] === 1 ? 1 : 0;
    counts.push(c);
  }
  return counts;
}

function seriesOfMask(mask: readonly boolean[]): Series {
  const present = Uint8Array.from(mask, (m) => (m ? 1 : 0));
  const values = Float64Array.from(mask, (m, t) => (m ? t : NaN));
  const count = present.reduce((s, m) => s + m, 0);
  return { values, present, label: "", count, gaps: mask.length - count };
}

describe("pairCounts(series, K) with gaps equals counting pair by pair", () => {
  it("for every mask with both ends present, K from 0 to past the length (property)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.boolean(), { minLength: 0, maxLength: 120 }),
        fc.integer({ min: 0, max: 140 }),
        (inner, maxLag) => {
          const mask = [true, ...inner, true];
          const series = seriesOfMask(mask);
          expect(Array.from(pairCounts(series, maxLag))).toEqual(
            countPairs(series.present, maxLag),
          );
        },
      ),
      { numRuns: 300, seed: 20_240_605 },
    );
  });

  it("with 90% gaps over 3,000 positions and K = 60", () => {
    const random = seededRandom(3000);
    const mask = Array.from(
      { length: 3000 },
      (_, t) => t === 0 || t === 2999 || random.uniform() < 0.1,
    );
    const series = seriesOfMask(mask);
    expect(Array.from(pairCounts(series, 60))).toEqual(countPairs(series.present, 60));
  });
});

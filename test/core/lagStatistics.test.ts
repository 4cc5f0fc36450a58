/**
 * The lag sums of the permutation reference (lagStatistics.ts): computed two lags at a time, each
 * s_k must be bit for bit the sum its file's comment defines — four interleaved partial sums over
 * whole groups of four, the rest into the first, combined as s0 + s1 + (s2 + s3) — written out
 * here one lag at a time as the definition. Every length from 1 to 40 and random longer ones, every
 * lag up to the length; fast-check draws the values.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { plainLagSums } from "../../src/core/lagStatistics";

/** The definition, one lag at a time. */
function definedLagSum(a: Float64Array, k: number): number {
  const partial = [0, 0, 0, 0];
  const groups = Math.max(0, Math.floor((a.length - k) / 4));
  for (let t = k; t < a.length; t++) {
    const c = t < k + 4 * groups ? (t - k) % 4 : 0;
    partial[c] = (partial[c] as number) + (a[t] as number) * (a[t - k] as number);
  }
  const [s0, s1, s2, s3] = partial as [number, number, number, number];
  return s0 + s1 + (s2 + s3);
}

const arrays = fc
  .oneof(fc.integer({ min: 1, max: 40 }), fc.integer({ min: 41, max: 400 }))
  .chain((length) =>
    fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), {
      minLength: length,
      maxLength: length,
    }),
  )
  .map((values) => Float64Array.from(values));

describe("plainLagSums(a, K)", () => {
  it("gives each s_k bit for bit as its definition orders the additions", () => {
    fc.assert(
      fc.property(arrays, (a) => {
        const maxLag = a.length;
        const sums = new Float64Array(maxLag + 1);
        plainLagSums(a, maxLag, sums);
        for (let k = 1; k <= maxLag; k++) {
          expect(Object.is(sums[k], definedLagSum(a, k)), `lag ${k} of ${a.length}`).toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  });
});

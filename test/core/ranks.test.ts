/**
 * The rank shortcuts of the permutation reference (one sort a column instead of three) against
 * the plain definitions they replace, on arrays with many ties: exact equality, every input.
 * Properties checked with fast-check; the definitions are the ones in ranks.ts's comments.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { commonLevel } from "../../src/core/verdictReference";
import {
  countAtLeast,
  kthLargest,
  kthLargestOfRest,
  kthSmallest,
  sortAscending,
  upperCounts,
} from "../../src/core/ranks";

/** Arrays of 2–60 values drawn from a few levels, so ties are common. */
const tiedArrays = fc
  .array(fc.integer({ min: 0, max: 6 }), { minLength: 2, maxLength: 60 })
  .map((levels) => Float64Array.from(levels, (l) => l * 0.25));

describe("countAtLeast(values, x) and kthLargestOfRest(values, sorted, j)", () => {
  it("equal upperCounts(values)[i] and kthLargest(values, j, 1) for every input", () => {
    fc.assert(
      fc.property(tiedArrays, fc.integer({ min: -1, max: 62 }), (values, j) => {
        const counts = upperCounts(values);
        for (let i = 0; i < values.length; i++) {
          expect(countAtLeast(values, values[i] as number)).toBe(counts[i]);
        }
        const sorted = values.slice().sort();
        expect(kthLargestOfRest(values, sorted, j)).toBe(kthLargest(values, j, 1));
      }),
    );
  });
});

describe("commonLevel(columns, alpha)", () => {
  it("gives the level and critical values of the definition with a sort per rank query", () => {
    fc.assert(
      fc.property(
        fc
          .integer({ min: 2, max: 60 })
          .chain((size) =>
            fc.tuple(
              fc.array(fc.integer({ min: 0, max: 5 }), { minLength: size, maxLength: size }),
              fc.array(fc.integer({ min: 0, max: 5 }), { minLength: size, maxLength: size }),
            ),
          ),
        fc.constantFrom(0.01, 0.05, 0.1, 0.5),
        ([a, b], alpha) => {
          const columns = [Float64Array.from(a), Float64Array.from(b)];
          const size = a.length;
          // The definition, spelled out with the plain helpers.
          const s = new Float64Array(size).fill(Infinity);
          for (const column of columns) {
            const counts = upperCounts(column);
            for (let i = 0; i < size; i++) s[i] = Math.min(s[i] as number, counts[i] as number);
          }
          const allowed = Math.floor(alpha * size + 1e-9);
          const aCount = allowed >= 1 ? kthSmallest(s, allowed, 1) : 0;
          const expected = {
            level: Number.isFinite(aCount) ? aCount / size : 1,
            criticals: columns.map((column) => kthLargest(column, aCount - 1, 1)),
          };
          expect(commonLevel(columns, alpha)).toEqual(expected);
        },
      ),
    );
  });
});

/** Arrays of 0–700 doubles with ties, signed zeros, infinities and the odd NaN. */
const awkwardArrays = fc
  .array(
    fc.oneof(
      { weight: 6, arbitrary: fc.integer({ min: -5, max: 5 }).map((l) => l * 0.5) },
      { weight: 4, arbitrary: fc.double({ noNaN: true }) },
      { weight: 1, arbitrary: fc.constantFrom(-0, 0, Infinity, -Infinity, NaN) },
    ),
    { maxLength: 700 },
  )
  .map((values) => Float64Array.from(values));

describe("sortAscending(values) and kthSmallest(values, j, from)", () => {
  it("give exactly the typed array's own sort: −0 before +0, NaN last, every input", () => {
    fc.assert(
      fc.property(awkwardArrays, (values) => {
        const expected = values.slice().sort();
        const got = sortAscending(values.slice());
        expect(got.length).toBe(expected.length);
        for (let i = 0; i < got.length; i++) expect(Object.is(got[i], expected[i])).toBe(true);
      }),
      { numRuns: 400 },
    );
  });

  it("kthSmallest is the j-th of the sorted rest, for every j and from", () => {
    fc.assert(
      fc.property(
        awkwardArrays,
        fc.integer({ min: -1, max: 702 }),
        fc.integer({ min: 0, max: 3 }),
        (values, j, from) => {
          const rest = values.slice(Math.min(from, values.length)).sort();
          const expected = j >= 1 && j <= rest.length ? (rest[j - 1] as number) : Infinity;
          expect(Object.is(kthSmallest(values, j, from), expected)).toBe(true);
          // Without zeros and NaN the selection path runs instead of the fallback sort.
          const plain = values.filter((v) => v !== 0 && !Number.isNaN(v));
          const plainRest = plain.slice().sort();
          const plainExpected =
            j >= 1 && j <= plainRest.length ? (plainRest[j - 1] as number) : Infinity;
          expect(Object.is(kthSmallest(plain, j), plainExpected)).toBe(true);
        },
      ),
      { numRuns: 400 },
    );
  });
});

import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  batchCheck,
  LongBuilder,
  mergeSeriesResults,
  seriesFromNumbers,
  seriesResult,
  type LongTable,
} from "../../src/core";
import { CLI_LIKE_WORDS } from "../helpers/words";
import { ar1, whiteNoise } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";

function longOf(lines: readonly string[]): LongTable {
  const builder = new LongBuilder({
    origin: "long.csv",
    columns: { id: "item", time: "when", value: "error" },
    words: CLI_LIKE_WORDS,
  });
  lines.forEach((line, i) => builder.push(line.split(","), i + 1));
  return builder.finish();
}

const values = (table: LongTable, k: number) => Array.from(table.series[k]!.values);

describe("LongBuilder(rows in any order)", () => {
  it("groups by id, orders by time and puts a missing week as a gap in its place", () => {
    const table = longOf([
      "item,when,error",
      "b,2024-01-15,3",
      "a,2024-01-08,2",
      "a,2024-01-01,1",
      "b,2024-01-01,1",
      "a,2024-01-22,4",
      "a,2024-01-29,5",
    ]);
    expect(table.calendar).toEqual({ unit: "day", step: 7, filled: 2 });
    expect(table.series.map((s) => s.label)).toEqual(["b", "a"]);
    expect(values(table, 0)).toEqual([1, NaN, 3]);
    expect(values(table, 1)).toEqual([1, 2, NaN, 4, 5]);
  });

  it("reads a monthly calendar (month ends) with a missing month as a gap", () => {
    const table = longOf(["item,when,error", "a,2024-01-31,1", "a,2024-02-29,2", "a,2024-04-30,4"]);
    expect(table.calendar).toEqual({ unit: "month", step: 1, filled: 1 });
    expect(values(table, 0)).toEqual([1, 2, NaN, 4]);
  });

  it("reads yyyymmdd numbers as dates and whole numbers as periods", () => {
    const daily = longOf(["item,when,error", "a,20240102,2", "a,20240101,1", "a,20240104,4"]);
    expect(daily.calendar).toEqual({ unit: "day", step: 1, filled: 1 });
    expect(values(daily, 0)).toEqual([1, 2, NaN, 4]);
    const periods = longOf(["item,when,error", "a,3,3", "a,1,1", "a,5,5"]);
    expect(periods.calendar).toEqual({ unit: "period", step: 2, filled: 0 });
    expect(values(periods, 0)).toEqual([1, 3, 5]);
  });

  it("refuses a duplicate (id, time), naming both lines", () => {
    expect(() =>
      longOf(["item,when,error", "a,2024-01-01,1", "a,2024-01-02,1", "a,2024-01-01,2"]),
    ).toThrow(/item "a" has two rows for 2024-01-01: lines 2 and 4 of long\.csv/);
  });

  it("keeps an id with a bad value out, with the line, and the others in", () => {
    const table = longOf([
      "item,when,error",
      "a,1,1",
      "a,2,nan",
      "a,3,2",
      "b,1,1",
      "b,2,2",
      "b,3,0",
    ]);
    expect(table.series.map((s) => s.label)).toEqual(["b"]);
    expect(table.notAnalysed[0]!.reason).toMatch(
      /line 3, column 3 \("error"\) of long\.csv holds "nan"/,
    );
  });
});

describe("mergeSeriesResults(parts)", () => {
  // 30 series of 60 values: noise and lag-1 dependent, so q-values spread over (0, 1].
  const rng = seededRandom(20261202);
  const list = Array.from({ length: 30 }, (_, i) =>
    seriesFromNumbers(
      i % 3 === 0 ? ar1(rng, 60, 0.6) : whiteNoise(rng, 60),
      `s${String(i).padStart(2, "0")}`,
    ),
  );
  const results = list.map((s, i) => seriesResult(s, i));
  const whole = batchCheck(list);
  const byLabel = new Map(whole.rows.map((r) => [r.label, r]));

  it("gives the whole batch's q-values, verdicts and counts for any split into parts", () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 0, max: 4 }), { minLength: 30, maxLength: 30 }),
        fc.array(fc.nat(), { minLength: 30, maxLength: 30 }),
        (partOf, shuffle) => {
          const parts: (typeof results)[] = [[], [], [], [], []];
          const order = results
            .map((r, i) => ({ r, key: shuffle[i]! }))
            .sort((a, b) => a.key - b.key);
          order.forEach(({ r }, i) => parts[partOf[i]!]!.push(r));
          const merged = mergeSeriesResults(parts.reverse().flat());
          expect(merged.flaggedRaw).toBe(whole.flaggedRaw);
          expect(merged.flaggedFdr).toBe(whole.flaggedFdr);
          expect(merged.analysed).toBe(whole.analysed);
          for (const row of merged.rows) {
            const same = byLabel.get(row.label)!;
            expect(row.qValue).toBe(same.qValue);
            expect(row.verdict).toBe(same.verdict);
            expect(row.p).toBe(same.p);
          }
          expect(merged.rows.map((r) => r.label)).toEqual(list.map((s) => s.label));
        },
      ),
      { numRuns: 50, seed: 12 },
    );
  });

  it("refuses parts checked at different levels, and a series in two parts", () => {
    const other = seriesResult(list[0]!, 0, { alpha: 0.01 });
    expect(() => mergeSeriesResults([results[1]!, other])).toThrow(/different levels/);
    expect(() => mergeSeriesResults([results[1]!, results[1]!])).toThrow(/in the parts twice/);
  });
});

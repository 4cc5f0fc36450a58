/**
 * LongBuilder.finishStreaming(): the long table with each id's series made only when it is taken
 * (a batch of a million ids never holds a million series), the same series as finish(), every
 * refusal of the whole table before the first series, the ids not analysed listed once the
 * series have been taken, and the rows let go then.
 */
import { describe, expect, it } from "vitest";
import { LongBuilder } from "../../src/core";
import { CLI_LIKE_WORDS } from "../helpers/words";

function builderOf(lines: readonly string[]): LongBuilder {
  const builder = new LongBuilder({
    origin: "long.csv",
    columns: { id: "item", time: "when", value: "error" },
    words: CLI_LIKE_WORDS,
  });
  lines.forEach((line, i) => builder.push(line.split(","), i + 1));
  return builder;
}

const LINES = [
  "item,when,error",
  "b,1,3",
  "a,2,2",
  "bad,1,oops",
  "a,1,1",
  "b,2,1",
  "a,4,4",
  "bad,2,1",
];

describe("LongBuilder.finishStreaming()", () => {
  it("makes the series of finish() one at a time, and lists the ids left out once they are taken", () => {
    const whole = builderOf(LINES).finish();
    const builder = builderOf(LINES);
    const stream = builder.finishStreaming();
    expect(stream.ids).toBe(3);
    expect(stream.calendar).toEqual(whole.calendar);
    const iterator = stream.series[Symbol.iterator]();
    const first = iterator.next();
    expect(first.done).toBe(false);
    expect(Array.from(first.done === true ? [] : first.value.values)).toEqual(
      Array.from(whole.series[0]!.values),
    );
    expect(stream.notAnalysed).toEqual([]);
    const rest = [];
    for (let step = iterator.next(); step.done !== true; step = iterator.next()) {
      rest.push(step.value);
    }
    expect(rest.map((s) => s.label)).toEqual(whole.series.slice(1).map((s) => s.label));
    expect(stream.notAnalysed).toEqual(whole.notAnalysed);
    expect(stream.notAnalysed.map((n) => n.label)).toEqual(["bad"]);
    // The rows are let go once the last series is made: the builder is spent.
    expect(() => builder.finishStreaming()).toThrow(/has a header but no rows/);
  });

  it("refuses an irregular calendar before making any series", () => {
    const builder = builderOf(["item,when,error", "a,1,1", "a,2,2", "b,1,1", "b,100000,2"]);
    expect(() => builder.finishStreaming()).toThrow(/do not form a regular calendar/);
  });
});

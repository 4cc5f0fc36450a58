/**
 * The memory of `echolot check` on a long series, asserted by structure rather than by a
 * resident-set reading (which a loaded machine blurs): beside the series itself (8 bytes a value
 * and a presence byte), each step of the check — the lag table, then each side check, with a
 * full collection between them in the CLI — allocates at most one array of the series' length
 * and a byte mask, so no step holds more than 9 more bytes a value. The measured peak on 30
 * million rows is in the README (`npm run scale`). The count covers arrays made with `new` or
 * `from` on the typed-array constructors, which is how the core allocates.
 */
import { afterEach, describe, expect, it } from "vitest";
import { lagTable, seriesFromValues, type Series } from "../../src/core";
import { sideChecks } from "../../src/report/sideChecks";
import { whiteNoise } from "../../src/sim/processes";
import { seededRandom } from "../../src/sim/random";

const N = 300_000;
const KINDS = ["Float64Array", "Float32Array", "Int32Array", "Uint32Array", "Uint8Array"] as const;
const originals = new Map(KINDS.map((kind) => [kind, globalThis[kind]]));

/**
 * Bytes of arrays at least half the series long allocated per step, while counting is on (the
 * regression blocks and the draws of the references are smaller, and their size does not grow
 * with the series).
 */
let tally: Map<string, number> | undefined;
let step = "";

function startCounting(): void {
  tally = new Map();
  for (const kind of KINDS) {
    const Base = originals.get(kind) as Float64ArrayConstructor;
    const Counting = class extends Base {
      constructor(...args: unknown[]) {
        super(...(args as [number]));
        // Views on a buffer that exists already cost nothing new.
        if (this.length >= N / 2 && !(args[0] instanceof ArrayBuffer) && tally !== undefined) {
          tally.set(step, (tally.get(step) ?? 0) + this.byteLength);
        }
      }
    };
    (globalThis as Record<string, unknown>)[kind] = Counting;
  }
}

afterEach(() => {
  for (const kind of KINDS) (globalThis as Record<string, unknown>)[kind] = originals.get(kind);
  tally = undefined;
});

function longSeries(gaps: boolean): Series {
  const values: (number | null)[] = Array.from(whiteNoise(seededRandom(5), N));
  if (gaps) for (let t = 1000; t < N; t += 997) values[t] = null;
  return seriesFromValues(values);
}

describe("the check's steps (lagTable, then sideChecks)", () => {
  for (const gaps of [false, true]) {
    it(`allocate at most 9 bytes a value each beside the series (${gaps ? "with" : "without"} gaps)`, () => {
      const series = longSeries(gaps);
      startCounting();
      step = "lag table";
      const table = lagTable(series, {});
      const names = ["volatility", "bias", "runs", "normality"];
      let next = 0;
      const side = sideChecks(series, table, () => {
        step = names[next++] as string;
      });
      const counted = tally as Map<string, number>;
      tally = undefined;
      for (const name of ["lag table", ...names]) {
        const bytes = counted.get(name) ?? 0;
        expect(bytes / N, `${name}: bytes a value allocated in long arrays`).toBeLessThanOrEqual(9);
      }
      // Each step did its work: the counts above are not those of skipped checks.
      for (const check of [side.volatility, side.bias, side.runs, side.normality]) {
        expect(typeof check, "a side check that could not run").toBe("object");
      }
      expect(counted.get("volatility"), "volatility allocates its one array").toBe(8 * N);
    });
  }
});

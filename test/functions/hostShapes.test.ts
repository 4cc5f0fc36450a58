/**
 * The built cell functions (dist/functions.js) with inputs in every shape the host documents for
 * them: #N/A as the runtime's error object and as a data-type error object (test/functions/host.ts
 * cites where each comes from), a whole-column reference, and an explicit season of 0 in place of
 * an empty middle argument.
 */
import { beforeAll, describe, expect, it } from "vitest";
import {
  columnRange,
  errorCell,
  ErrorCode,
  loadBuiltFunctions,
  spilled,
  type ErrorShape,
  type FunctionMetadata,
  type LoadedAddIn,
} from "./host";
import { seriesFColumn } from "../pane/seriesF";

const SHAPES: readonly ErrorShape[] = ["error-object", "data-type", "flags"];

/** Arguments for any ECHOLOT function: the given column (or a two-column block), a window of 30. */
function argumentsFor(fn: FunctionMetadata, column: readonly unknown[]): unknown[] {
  return fn.parameters.map((p) => {
    if (p.name === "block") return column.map((cell, i) => [cell, i === 0 ? "other" : i % 7]);
    if (p.dimensionality === "matrix") return columnRange(column);
    if (p.name === "window") return 30;
    return null;
  });
}

describe("#N/A gaps in every shape the host may pass them", () => {
  let withGaps: unknown[];
  let withBlanks: unknown[];
  const loaded = new Map<ErrorShape, LoadedAddIn>();

  beforeAll(() => {
    for (const shape of SHAPES) loaded.set(shape, loadBuiltFunctions(shape));
    const f = seriesFColumn();
    withGaps = f.map((v, i) => (i === 12 || i === 40 ? errorCell(ErrorCode.notAvailable) : v));
    withBlanks = f.map((v, i) => (i === 12 || i === 40 ? "" : v));
  });

  for (const shape of SHAPES) {
    it(`every function takes #N/A (${shape}) exactly as a blank gap`, () => {
      const addIn = loaded.get(shape) as LoadedAddIn;
      expect(addIn.metadata.functions.length).toBeGreaterThanOrEqual(15);
      for (const fn of addIn.metadata.functions) {
        const gaps = addIn.invoke(fn.id, ...argumentsFor(fn, withGaps));
        const blanks = addIn.invoke(fn.id, ...argumentsFor(fn, withBlanks));
        expect(spilled(gaps, `${fn.id} with #N/A (${shape})`)).toEqual(
          spilled(blanks, `${fn.id} with blanks`),
        );
      }
    });

    it(`any other error (${shape}) is refused with #VALUE!, naming its row`, () => {
      const addIn = loaded.get(shape) as LoadedAddIn;
      const cells = seriesFColumn().map((v, i) =>
        i === 12 ? errorCell(ErrorCode.divisionByZero) : v,
      );
      const result = addIn.invoke("SERIESLAGTABLE", columnRange(cells));
      expect(result).toEqual({
        error: expect.objectContaining({
          code: ErrorCode.invalidValue,
          message:
            "row 13 of the range holds the error #DIV/0!; fix that cell or make it blank or #N/A (a gap)",
        }),
      });
    });
  }
});

describe("SERIESROLLCHECK spills in proportion to the data", () => {
  it("a whole-column reference (1,048,576 rows) spills down to the last row holding a value", () => {
    const addIn = loadBuiltFunctions();
    const f = seriesFColumn();
    const whole: unknown[][] = Array.from({ length: 1_048_576 }, (_, i) => [f[i] ?? ""]);
    const result = spilled(addIn.invoke("SERIESROLLCHECK", whole, 30), "whole column");
    expect(result).toHaveLength(71);
    expect(result[0]).toEqual([""]);
    expect(typeof result[70]?.[0]).toBe("number");
    // The same as the exact range: the rows below the data add nothing.
    expect(result).toEqual(
      spilled(addIn.invoke("SERIESROLLCHECK", columnRange(f), 30), "exact range"),
    );
  });
});

describe("season 0 means no season, so formulas need no empty middle argument", () => {
  it("SERIESNOISECHECK(series, 10, 0, 0, 0.05) equals SERIESNOISECHECK(series, 10)", () => {
    const addIn = loadBuiltFunctions();
    const f = columnRange(seriesFColumn());
    expect(spilled(addIn.invoke("SERIESNOISECHECK", f, 10, 0, 0, 0.05), "season 0")).toEqual(
      spilled(addIn.invoke("SERIESNOISECHECK", f, 10), "omitted"),
    );
  });
});

describe("the registry the pane recomputes failed cells with", () => {
  it("holds every function the bundle associates, under the same id", () => {
    const addIn = loadBuiltFunctions();
    expect(Object.keys(addIn.byId).sort()).toEqual([...addIn.registered].sort());
  });
});

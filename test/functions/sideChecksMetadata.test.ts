/**
 * The eight side-check functions in the generated dist/functions.json: DESIGN.md's ids and
 * argument names in DESIGN.md's order, each argument's type, optionality and dimensionality, and
 * descriptions that say the defaults.
 */
import { describe, expect, it } from "vitest";
import { readFunctionsJson, type FunctionMetadata } from "./host";
import { EXTRA_FUNCTIONS } from "./sideCheckFunctions";

type Kind = "range" | "number" | "required number";
const SIGNATURES: Record<(typeof EXTRA_FUNCTIONS)[number], readonly [string, Kind][]> = {
  SERIESVOLCHECK: [
    ["series", "range"],
    ["lags", "number"],
  ],
  SERIESBIASCHECK: [
    ["series", "range"],
    ["hacLags", "number"],
  ],
  SERIESFORECASTAUDIT: [
    ["errors", "range"],
    ["horizon", "number"],
    ["season", "number"],
    ["alpha", "number"],
  ],
  SERIESBATCHCHECK: [
    ["block", "range"],
    ["maxLag", "number"],
    ["season", "number"],
    ["fittedParams", "number"],
    ["alpha", "number"],
  ],
  SERIESCROSSCORR: [
    ["x", "range"],
    ["y", "range"],
    ["maxLag", "number"],
  ],
  SERIESROLLCHECK: [
    ["series", "range"],
    ["window", "required number"],
    ["lags", "number"],
    ["step", "number"],
  ],
  SERIESRUNSCHECK: [["series", "range"]],
  SERIESNORMALCHECK: [["series", "range"]],
};

const metadata = readFunctionsJson();
const byId = new Map<string, FunctionMetadata>(metadata.functions.map((f) => [f.id, f]));

describe("dist/functions.json: the side-check functions", () => {
  for (const [id, signature] of Object.entries(SIGNATURES)) {
    it(`${id}: arguments, types, optionality and dimensionality as DESIGN.md names them`, () => {
      const f = byId.get(id);
      if (f === undefined) throw new Error(`${id} missing from functions.json`);
      expect(f.parameters.map((p) => p.name)).toEqual(signature.map(([name]) => name));
      signature.forEach(([name, kind], i) => {
        const p = f.parameters[i];
        const where = `${id} argument ${name}`;
        if (p === undefined) throw new Error(`${where} missing`);
        if (kind === "range") {
          expect(p.type, where).toBe("any");
          expect(p.dimensionality, where).toBe("matrix");
          expect(p.optional ?? false, where).toBe(false);
        } else {
          expect(p.type, where).toBe("number");
          expect(p.dimensionality ?? "scalar", where).toBe("scalar");
          expect(p.optional ?? false, where).toBe(kind === "number");
        }
        expect((p.description ?? "").length, `${where} description`).toBeGreaterThan(20);
        if (p.optional === true) {
          expect(p.description, `${where} says its default or range`).toMatch(
            /Default|from \d|between/,
          );
        }
      });
      expect(f.result.dimensionality).toBe("matrix");
      expect(f.description.length, `${id} description`).toBeGreaterThan(30);
      expect(f.description).not.toContain("\n");
    });
  }
});

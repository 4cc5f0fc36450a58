/**
 * The generated dist/functions.json: exactly the functions of this issue, each argument's name,
 * type, optionality and dimensionality, the allowErrorForDataTypeAny flag, and names only from
 * DESIGN.md's scheme (SERIES… ids, camelCase argument words).
 */
import { describe, expect, it } from "vitest";
import { readFunctionsJson, type FunctionMetadata } from "./host";
import { EXTRA_FUNCTIONS } from "./sideCheckFunctions";

type Kind = "series" | "number" | "keyword";
const SIGNATURES: Record<string, readonly [string, Kind][]> = {
  SERIESLAGCOV: [
    ["series", "series"],
    ["maxLag", "number"],
  ],
  SERIESLAGCORR: [
    ["series", "series"],
    ["maxLag", "number"],
  ],
  SERIESPARTIALCORR: [
    ["series", "series"],
    ["maxLag", "number"],
  ],
  SERIESBAND: [
    ["series", "series"],
    ["maxLag", "number"],
    ["alpha", "number"],
    ["bandKind", "keyword"],
  ],
  SERIESLAGTABLE: [
    ["series", "series"],
    ["maxLag", "number"],
    ["alpha", "number"],
    ["bandKind", "keyword"],
    ["season", "number"],
  ],
  SERIESPORTMANTEAU: [
    ["series", "series"],
    ["lags", "number"],
    ["fittedParams", "number"],
    ["testKind", "keyword"],
  ],
  SERIESNOISECHECK: [
    ["series", "series"],
    ["maxLag", "number"],
    ["season", "number"],
    ["fittedParams", "number"],
    ["alpha", "number"],
  ],
};

/** DESIGN.md's function table and argument words. */
const DESIGN_FUNCTIONS = [
  "SERIESLAGCOV",
  "SERIESLAGCORR",
  "SERIESPARTIALCORR",
  "SERIESBAND",
  "SERIESLAGTABLE",
  "SERIESPORTMANTEAU",
  "SERIESNOISECHECK",
  "SERIESVOLCHECK",
  "SERIESBIASCHECK",
  "SERIESFORECASTAUDIT",
  "SERIESBATCHCHECK",
  "SERIESCROSSCORR",
  "SERIESROLLCHECK",
  "SERIESRUNSCHECK",
  "SERIESNORMALCHECK",
];
const DESIGN_ARGUMENTS = new Set([
  "series",
  "maxLag",
  "lags",
  "alpha",
  "season",
  "fittedParams",
  "bandKind",
  "testKind",
  "horizon",
  "window",
  "hacLags",
  "errors",
  "block",
  "x",
  "y",
  "step",
]);

const metadata = readFunctionsJson();
const byId = new Map<string, FunctionMetadata>(metadata.functions.map((f) => [f.id, f]));

describe("dist/functions.json", () => {
  it("carries allowErrorForDataTypeAny: true, so #N/A cells reach the functions as gaps", () => {
    expect(metadata.allowErrorForDataTypeAny).toBe(true);
  });

  it("lists exactly the seven functions of the cell-function set and the eight side checks", () => {
    expect(metadata.functions.map((f) => f.id).sort()).toEqual(
      [...Object.keys(SIGNATURES), ...EXTRA_FUNCTIONS].sort(),
    );
  });

  it("uses only DESIGN.md's function ids and argument names", () => {
    for (const f of metadata.functions) {
      expect(DESIGN_FUNCTIONS, `function ${f.id}`).toContain(f.id);
      expect(f.name, `${f.id} name`).toBe(f.id);
      expect(f.id).toMatch(/^[A-Z0-9._]{1,128}$/);
      for (const p of f.parameters) {
        expect(DESIGN_ARGUMENTS.has(p.name), `${f.id} argument ${p.name}`).toBe(true);
      }
    }
  });

  for (const [id, signature] of Object.entries(SIGNATURES)) {
    it(`${id}: arguments, types, optionality and dimensionality as specified`, () => {
      const f = byId.get(id);
      if (f === undefined) throw new Error(`${id} missing from functions.json`);
      expect(f.parameters.map((p) => p.name)).toEqual(signature.map(([name]) => name));
      signature.forEach(([name, kind], i) => {
        const p = f.parameters[i];
        const where = `${id} argument ${name}`;
        if (p === undefined) throw new Error(`${where} missing`);
        if (kind === "series") {
          expect(p.type, where).toBe("any");
          expect(p.dimensionality, where).toBe("matrix");
          expect(p.optional ?? false, where).toBe(false);
        } else {
          expect(p.type, where).toBe(kind === "number" ? "number" : "string");
          expect(p.dimensionality ?? "scalar", where).toBe("scalar");
          expect(p.optional, where).toBe(true);
        }
        expect((p.description ?? "").length, `${where} description`).toBeGreaterThan(20);
      });
      // Every result spills a 2-D array.
      expect(f.result.dimensionality).toBe("matrix");
      expect(f.description.length, `${id} description`).toBeGreaterThan(30);
      expect(f.description, `${id} description is one line for the wizard`).not.toContain("\n");
    });
  }

  it("describes each optional argument's default or allowed values", () => {
    for (const f of metadata.functions) {
      for (const p of f.parameters.filter((q) => q.optional === true)) {
        const text = p.description ?? "";
        expect(/Default|default|from \d|between/.test(text), `${f.id} ${p.name}: "${text}"`).toBe(
          true,
        );
      }
    }
  });
});

/**
 * The settings form's one number reader (taskpane/pane/settings.ts): decimal notation only, as the
 * CLI reads its options (src/cli/options.ts `numberOption`); a refusal carries the parameter the
 * pane matches to its field.
 */
import { describe, expect, it } from "vitest";
import { isEcholotError } from "../../src/core";
import { lagOptionsFromSettings, numberSetting } from "../../taskpane/pane/settings";

function refusalOf(read: () => unknown): { name: string | undefined; message: string } {
  try {
    read();
  } catch (error) {
    if (isEcholotError(error)) return { name: error.parameter?.name, message: error.message };
    throw error;
  }
  throw new Error("not refused");
}

describe("numberSetting(name, text)", () => {
  it("reads blank as the default and decimal numbers, spaces around them allowed", () => {
    expect(numberSetting("maxLag", "")).toBeNull();
    expect(numberSetting("maxLag", "   ")).toBeNull();
    expect(numberSetting("maxLag", " 12 ")).toBe(12);
    expect(numberSetting("alpha", "0.05")).toBe(0.05);
    expect(numberSetting("alpha", "5e-2")).toBe(0.05);
  });

  it("refuses hexadecimal, binary, trailing text and a decimal comma, naming the parameter", () => {
    for (const text of ["0x10", "0b11", "12abc", "0,05", "Infinity"]) {
      const refusal = refusalOf(() => numberSetting("maxLag", text));
      expect(refusal.name, text).toBe("maxLag");
      expect(refusal.message).toBe(`maxLag must be a number (got "${text}")`);
    }
  });

  it("is the reader lagOptionsFromSettings uses for every number field", () => {
    const text = {
      maxLag: "0x10",
      season: "",
      fittedParams: "",
      alpha: "",
      bandKind: "bartlett",
      testKind: "ljung-box",
      check: "noise",
      horizon: "",
    };
    expect(refusalOf(() => lagOptionsFromSettings(text)).name).toBe("maxLag");
    expect(lagOptionsFromSettings({ ...text, maxLag: "16" }).maxLag).toBe(16);
  });
});

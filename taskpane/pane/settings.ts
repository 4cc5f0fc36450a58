/**
 * The settings form as the core's lag options. A blank field means the default; a number is read
 * strictly, in decimal notation as the CLI reads its options ("12abc" and "0x10" are refused, not
 * read as 12 and 16). Ranges and their messages are the core's.
 */
import {
  isNumberText,
  parseBandKind,
  parseTestKind,
  refuseParameter,
  type LagOptions,
  type ParameterName,
} from "../../src/core";

/** The text of each setting, as the form holds it. */
export interface SettingsText {
  readonly maxLag: string;
  readonly season: string;
  readonly fittedParams: string;
  readonly alpha: string;
  readonly bandKind: string;
  readonly testKind: string;
  /** "noise" (the noise check) or "audit" (the forecast audit). */
  readonly check: string;
  readonly horizon: string;
}

/** The form's fields, each named by the core's name for the parameter it sets. */
export const SETTING_NAMES = [
  "maxLag",
  "season",
  "fittedParams",
  "alpha",
  "bandKind",
  "testKind",
  "horizon",
] as const satisfies readonly ParameterName[];
export type SettingName = (typeof SETTING_NAMES)[number];

/**
 * The one number reader of the form: blank is the default (null); anything else a finite number
 * in decimal notation (`Number` alone would take "0x10" as 16 and "0b11" as 3).
 */
export function numberSetting(name: SettingName, text: string): number | null {
  const trimmed = text.trim();
  if (trimmed === "") return null;
  const value = isNumberText(trimmed) ? Number(trimmed) : NaN;
  if (!Number.isFinite(value)) {
    refuseParameter({ name, allows: "number" }, `${name} must be a number (got "${text}")`);
  }
  return value;
}

/** The lag table and verdict options from the settings form's text. */
export function lagOptionsFromSettings(text: SettingsText): LagOptions {
  return {
    maxLag: numberSetting("maxLag", text.maxLag),
    season: numberSetting("season", text.season),
    fittedParams: numberSetting("fittedParams", text.fittedParams),
    alpha: numberSetting("alpha", text.alpha),
    bandKind: parseBandKind(text.bandKind),
    testKind: parseTestKind(text.testKind),
  };
}

/** The forecast audit's horizon when the form asks for the audit (default 1), else null. */
export function auditHorizonFrom(text: SettingsText): number | null {
  if (text.check !== "audit") return null;
  return numberSetting("horizon", text.horizon) ?? 1;
}

/** The form's current text. */
export function readSettingsForm(form: HTMLFormElement): SettingsText {
  const field = (name: string) => {
    const control = form.elements.namedItem(name);
    return control instanceof HTMLInputElement || control instanceof HTMLSelectElement
      ? control.value
      : "";
  };
  return {
    maxLag: field("maxLag"),
    season: field("season"),
    fittedParams: field("fittedParams"),
    alpha: field("alpha"),
    bandKind: field("bandKind"),
    testKind: field("testKind"),
    check: field("check") || "noise",
    horizon: field("horizon"),
  };
}

/** Puts a scenario's suggested settings into the form (blank for the default). */
export function writeSettingsForm(form: HTMLFormElement, options: LagOptions): void {
  const set = (name: string, value: string) => {
    const control = form.elements.namedItem(name);
    if (control instanceof HTMLInputElement || control instanceof HTMLSelectElement) {
      control.value = value;
    }
  };
  const text = (x: number | null | undefined) => (x === null || x === undefined ? "" : String(x));
  set("maxLag", text(options.maxLag));
  set("season", text(options.season));
  set("fittedParams", text(options.fittedParams));
  set("alpha", text(options.alpha));
  set("bandKind", options.bandKind ?? "noise");
  set("testKind", options.testKind ?? "ljung-box");
}

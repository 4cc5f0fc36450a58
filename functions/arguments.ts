/**
 * Reading the host's arguments. Series arguments arrive as untyped 2-D cell arrays (`any[][]`, so
 * a blank is never mistaken for 0) and go through the core's intake. Scalar arguments may arrive
 * as `null` (omitted), as a number, or — through a cell reference — as "" for a blank cell; each
 * is checked here for its type, and the core then checks its range and writes the message. Every
 * scalar is read by the core's name for it; `cellFunction` spells that name as the function's
 * argument where the two differ (`ArgumentNames`).
 */
import {
  cellErrorCode,
  invalid,
  refuseParameter,
  seriesFromCells,
  type ParameterName,
  type Series,
} from "../src/core";

/** A function's argument names where they differ from the core's names for its parameters. */
export type ArgumentNames = Readonly<Partial<Record<ParameterName, string>>>;

/** A series range, one row or one column; a 2-D block or a non-range is refused. */
export function readSeries(cells: unknown, name = "series"): Series {
  if (!Array.isArray(cells) || !cells.every((row) => Array.isArray(row))) {
    invalid(`${name} must be a range of cells: a single row or column such as B2:B241`);
  }
  return seriesFromCells(cells as readonly (readonly unknown[])[]);
}

function describe(value: unknown): string {
  const code = cellErrorCode(value);
  if (code !== undefined) return `the error ${code}`;
  if (typeof value === "string")
    return `the text "${value.length > 24 ? `${value.slice(0, 24)}…` : value}"`;
  if (typeof value === "boolean") return value ? "TRUE" : "FALSE";
  return String(value);
}

/**
 * An optional number: omitted, `null` or a blank cell means "use the default" (`null`). Text —
 * even text that looks like a number — a boolean, an error value or a non-finite number is
 * refused.
 */
export function optionalNumber(name: ParameterName, value: unknown): number | null {
  if (value === null || value === undefined || value === "") return null;
  if (typeof value === "number" && Number.isFinite(value)) return value;
  const parameter = { name, allows: "number" } as const;
  if (typeof value === "string" && value.trim() !== "" && Number.isFinite(Number(value))) {
    refuseParameter(
      parameter,
      `${name} must be a number, not text (got ${describe(value)}); type it without quotes`,
    );
  }
  return refuseParameter(parameter, `${name} must be a number (got ${describe(value)})`);
}

/**
 * A number the function cannot do without, read as `optionalNumber` reads it; omitted or blank,
 * it is refused with what to give (`wanted`: "the rows per window, …").
 */
export function requiredNumber(name: ParameterName, value: unknown, wanted: string): number {
  const number = optionalNumber(name, value);
  if (number === null) {
    refuseParameter(
      { name, allows: "number" },
      `${name} was not given (omitted, or a blank cell): give ${wanted}`,
    );
  }
  return number;
}

/**
 * An optional season: omitted, blank or 0 means "no season". The 0 lets a formula name the
 * arguments after it without leaving an empty argument between commas, whose handling the
 * host's documentation does not state (the pane's live reports write it so).
 */
export function optionalSeason(value: unknown): number | null {
  const season = optionalNumber("season", value);
  return season === 0 ? null : season;
}

/** An optional keyword: passed on as it came; the core's keyword readers check it. */
export function optionalKeyword(value: unknown): unknown {
  return value ?? null;
}

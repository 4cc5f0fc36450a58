/** Fixed-width cells for the terminal tables: the lag table, the batch check and the forecast audit. */
import { isPValueBound } from "../core";

/** A number to `digits` decimals, right-aligned; "—" when undefined. */
export function paddedNumber(x: number, digits: number, width: number): string {
  return (Number.isFinite(x) ? x.toFixed(digits) : "—").padStart(width);
}

/** A p-value or q-value: four decimals, or two significant digits below 0.0001; "<1e-300" at the floor. */
export function paddedP(p: number, width: number): string {
  if (Number.isNaN(p)) return "—".padStart(width);
  if (isPValueBound(p)) return "<1e-300".padStart(width);
  return (p >= 0.0001 ? p.toFixed(4) : p.toExponential(1)).padStart(width);
}

/** A statistic to `digits` significant figures, right-aligned; "—" when undefined. */
export function paddedFigure(x: number, digits: number, width: number): string {
  if (!Number.isFinite(x)) return "—".padStart(width);
  return String(Number(x.toPrecision(digits))).padStart(width);
}

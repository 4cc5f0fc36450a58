/**
 * Reads an ECHOLOT formula as the host gives it through `Range.formulas` (English function names,
 * comma separators, A1 references): the function's id and each argument as a reference, a number,
 * a text literal or an omitted argument. Anything else (a nested function, arithmetic, a defined
 * name) makes the whole formula unreadable here: the pane then says it cannot recompute it.
 */

export type FormulaArgument =
  | { readonly kind: "reference"; readonly sheet: string | null; readonly range: string }
  | { readonly kind: "number"; readonly value: number }
  | { readonly kind: "text"; readonly value: string }
  | { readonly kind: "omitted" };

export interface EcholotCall {
  /** The function's id, such as "SERIESLAGTABLE". */
  readonly id: string;
  readonly args: readonly FormulaArgument[];
}

const CALL = /^=\s*ECHOLOT\.([A-Z0-9_.]+)\s*\((.*)\)\s*$/is;
const CORNER = String.raw`\$?[A-Za-z]{1,3}\$?\d+`;
const RANGE = new RegExp(
  String.raw`^(?:${CORNER}(?::${CORNER})?|\$?[A-Za-z]{1,3}:\$?[A-Za-z]{1,3}|\$?\d+:\$?\d+)$`,
);
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** Splits an argument list at top-level commas, keeping quoted text and sheet names whole. */
function splitArguments(list: string): string[] | null {
  const parts: string[] = [];
  let current = "";
  let quote: '"' | "'" | null = null;
  for (let i = 0; i < list.length; i++) {
    const ch = list[i] as string;
    if (quote !== null) {
      current += ch;
      if (ch === quote) {
        // A doubled quote inside quotes is one literal quote.
        if (list[i + 1] === quote) current += list[++i];
        else quote = null;
      }
    } else if (ch === '"' || ch === "'") {
      quote = ch;
      current += ch;
    } else if (ch === "(" || ch === ")") {
      return null;
    } else if (ch === ",") {
      parts.push(current);
      current = "";
    } else {
      current += ch;
    }
  }
  if (quote !== null) return null;
  parts.push(current);
  return parts;
}

function readArgument(raw: string): FormulaArgument | null {
  const text = raw.trim();
  if (text === "") return { kind: "omitted" };
  if (NUMBER.test(text)) return { kind: "number", value: Number(text) };
  if (text.length >= 2 && text.startsWith('"') && text.endsWith('"')) {
    return { kind: "text", value: text.slice(1, -1).replace(/""/g, '"') };
  }
  const bang = text.lastIndexOf("!");
  const range = bang < 0 ? text : text.slice(bang + 1);
  if (!RANGE.test(range)) return null;
  if (bang < 0) return { kind: "reference", sheet: null, range };
  const rawSheet = text.slice(0, bang);
  const sheet =
    rawSheet.startsWith("'") && rawSheet.endsWith("'")
      ? rawSheet.slice(1, -1).replace(/''/g, "'")
      : rawSheet;
  if (sheet === "" || /[[\]]/.test(sheet)) return null;
  return { kind: "reference", sheet, range };
}

/** The ECHOLOT call a formula makes, or null when it is not one this reader can follow. */
export function readEcholotCall(formula: string): EcholotCall | null {
  const match = CALL.exec(formula);
  if (match === null) return null;
  const parts = splitArguments(match[2] as string);
  if (parts === null) return null;
  const args: FormulaArgument[] = [];
  for (const part of parts) {
    const arg = readArgument(part);
    if (arg === null) return null;
    args.push(arg);
  }
  // "=F()" has no arguments, not one omitted one.
  if (args.length === 1 && args[0]?.kind === "omitted") args.length = 0;
  return { id: (match[1] as string).toUpperCase(), args };
}

/** Whether a formula calls an ECHOLOT function at its top level. */
export function isEcholotFormula(formula: unknown): formula is string {
  return typeof formula === "string" && /^=\s*ECHOLOT\./i.test(formula);
}

/**
 * A stand-in for the spreadsheet host, for loading the built add-in the way the host does: the
 * bundle dist/functions.js runs as a script in a fresh global scope that holds `CustomFunctions`
 * (with `associate`, `Error` and `ErrorCode`) and `Office`, and registers its functions through
 * `associate`. `invoke` then calls a function the way the host does — every declared parameter
 * passed, omitted optional ones as `null` — and returns the spilled array or the error value.
 */
import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { createContext, runInContext } from "node:vm";
import { BUILD_DIRECTORY, requireFreshBuild } from "../runner/builds";

export const DIST = BUILD_DIRECTORY.local;

/**
 * A file of the current local build. A stale bundle is refused (test/runner/builds.ts): comparing
 * it with the current core would mislead.
 */
export function distFile(name: string): string {
  const path = join(requireFreshBuild("local"), name);
  if (!existsSync(path)) {
    throw new Error(`${path} is missing: run "npm run build:test" first (npm test does it)`);
  }
  return path;
}

/** The host's error codes, as the runtime's `CustomFunctions.ErrorCode` holds them. */
export const ErrorCode = {
  invalidValue: "#VALUE!",
  notAvailable: "#N/A",
  divisionByZero: "#DIV/0!",
  invalidNumber: "#NUM!",
  nullReference: "#NULL!",
  invalidName: "#NAME?",
  invalidReference: "#REF!",
} as const;

/** An error value: what a function throws or returns, and what an error cell holds. */
export class HostError {
  readonly code: string;
  readonly message: string | undefined;
  constructor(code: string, message?: string) {
    this.code = code;
    this.message = message;
  }
}

/**
 * An error cell as it reaches an `any` parameter when functions.json carries
 * `allowErrorForDataTypeAny` (learn.microsoft.com, "Handle and return errors from your custom
 * function": error codes supported as custom function input errors): the runtime's error object.
 */
export const errorCell = (code: string): HostError => new HostError(code);

/** Excel.ErrorCellValueType of each error code (@types/office-js, Excel.ErrorCellValueType). */
const ERROR_TYPES: Readonly<Record<string, string>> = {
  "#N/A": "NotAvailable",
  "#VALUE!": "Value",
  "#DIV/0!": "Div0",
  "#NUM!": "Num",
  "#NULL!": "Null",
  "#NAME?": "Name",
  "#REF!": "Ref",
  "#SPILL!": "Spill",
  "#CALC!": "Calc",
};

/**
 * An error cell as it reaches an `any` parameter when functions.json also carries
 * `allowCustomDataForDataTypeAny` (learn.microsoft.com, "Use data types with custom functions in
 * Excel": "A custom function can accept a data types error object"): an Excel.ErrorCellValue,
 * such as `{ type: "Error", basicValue: "#N/A", errorType: "NotAvailable" }`
 * (@types/office-js, Excel.NotAvailableErrorCellValue).
 */
export const dataTypeErrorCell = (code: string) => ({
  type: "Error",
  basicValue: code,
  errorType: ERROR_TYPES[code] ?? "Unknown",
});

/** The error cell's shape for this functions.json: a data-type object when its flag is on. */
export function errorCellFor(metadata: FunctionsJson, code: string): unknown {
  return metadata.allowCustomDataForDataTypeAny === true
    ? dataTypeErrorCell(code)
    : errorCell(code);
}

export type CellResult = (number | string)[][];
export type Invocation = { readonly value: CellResult } | { readonly error: HostError };

export interface FunctionMetadata {
  readonly id: string;
  readonly name: string;
  readonly description: string;
  readonly parameters: readonly {
    readonly name: string;
    readonly description?: string;
    readonly type: string;
    readonly dimensionality?: string;
    readonly optional?: boolean;
  }[];
  readonly result: { readonly dimensionality?: string; readonly type?: string };
}

export interface FunctionsJson {
  readonly allowErrorForDataTypeAny?: boolean;
  readonly allowCustomDataForDataTypeAny?: boolean;
  readonly functions: readonly FunctionMetadata[];
}

export function readFunctionsJson(): FunctionsJson {
  return JSON.parse(readFileSync(distFile("functions.json"), "utf8")) as FunctionsJson;
}

export interface LoadedAddIn {
  /** Functions in the order the bundle associated them. */
  readonly registered: readonly string[];
  readonly metadata: FunctionsJson;
  /** The bundle's registry of functions by id, as the pane finds it on the page's global scope. */
  readonly byId: Readonly<Record<string, (...args: unknown[]) => unknown>>;
  /** Calls `id` with `args`, padding omitted trailing parameters with null. */
  invoke(id: string, ...args: unknown[]): Invocation;
}

/** The shape error cells take in arguments: as the flags in functions.json say, or forced. */
export type ErrorShape = "flags" | "error-object" | "data-type";

/**
 * An argument as the host passes it: every error cell (written in tests as `errorCell(code)`)
 * in the shape the metadata's flags select.
 */
function asPassed(arg: unknown, shape: (code: string) => unknown): unknown {
  if (arg instanceof HostError) return shape(arg.code);
  if (Array.isArray(arg)) return arg.map((item: unknown) => asPassed(item, shape));
  return arg;
}

/** The first error cell in an argument, if any. */
function firstError(arg: unknown): HostError | undefined {
  if (arg instanceof HostError) return arg;
  if (!Array.isArray(arg)) return undefined;
  for (const item of arg as unknown[]) {
    const found = firstError(item);
    if (found !== undefined) return found;
  }
  return undefined;
}

/** The built-in globals of a fresh context that a script may name (not `eval`, not constants). */
const BUILT_INS: readonly string[] = (
  runInContext("Object.getOwnPropertyNames(globalThis)", createContext()) as string[]
).filter(
  (name) =>
    /^[A-Za-z_$][\w$]*$/.test(name) &&
    !["eval", "undefined", "NaN", "Infinity", "globalThis"].includes(name),
);

/**
 * Runs a script in the context with the context's own built-ins (Math, Float64Array, Number, …)
 * bound as parameters of a wrapping function. A Node vm context resolves every global name
 * through an interceptor on its sandbox object (nodejs.org/api/vm.html, "What does it mean to
 * 'contextify' an object?"), so each `Math.abs` in a hot loop became a call into C++: a
 * 1,048,576-row SERIESCROSSCORR took 14 s of CPU instead of 0.5 s. The host's runtime is a
 * plain global scope, where such lookups are ordinary. The bindings are the context's own
 * objects, so the script sees the same values; `globalThis` and the sandbox's names
 * (`CustomFunctions`, `Office`) are still looked up in the context. `lineOffset` keeps the
 * script's line numbers.
 */
function runAsScript(source: string, context: object, filename: string): void {
  const names = BUILT_INS.join(", ");
  runInContext(`(function (${names}) {\n${source}\n})(${names});`, context, {
    filename,
    lineOffset: -1,
  });
}

/**
 * Loads dist/functions.js into a fresh global scope with a fake host. Error cells reach the
 * functions as the host sends them: without `allowErrorForDataTypeAny` the host answers with the
 * input's error and never calls the function (learn.microsoft.com, "Handle and return errors from
 * your custom function"); with it, as the runtime's error object; with
 * `allowCustomDataForDataTypeAny` too, as a data-type error object (see `dataTypeErrorCell`).
 */
export function loadBuiltFunctions(errorShape: ErrorShape = "flags"): LoadedAddIn {
  const metadata = readFunctionsJson();
  const bundle = distFile("functions.js");
  const source = readFileSync(bundle, "utf8");
  const handlers = new Map<string, (...args: unknown[]) => unknown>();
  const registered: string[] = [];
  const CustomFunctions = {
    associate(id: string, handler: (...args: unknown[]) => unknown) {
      if (handlers.has(id)) throw new Error(`${id} associated twice`);
      handlers.set(id, handler);
      registered.push(id);
    },
    Error: HostError,
    ErrorCode,
  };
  const Office = {
    onReady: (callback?: (info: { host: string; platform: string }) => void) => {
      const info = { host: "Excel", platform: "OfficeOnline" };
      callback?.(info);
      return Promise.resolve(info);
    },
  };
  const context = createContext({ CustomFunctions, Office, console });
  runAsScript(source, context, "functions.js");

  function invoke(id: string, ...args: unknown[]): Invocation {
    const handler = handlers.get(id);
    const declared = metadata.functions.find((f) => f.id === id);
    if (handler === undefined || declared === undefined) throw new Error(`${id} is not registered`);
    if (args.length > declared.parameters.length) {
      throw new Error(`${id} takes ${declared.parameters.length} arguments, got ${args.length}`);
    }
    const padded = declared.parameters.map((_, i) => (i < args.length ? args[i] : null));
    if (errorShape === "flags" && metadata.allowErrorForDataTypeAny !== true) {
      const passedOn = padded.map(firstError).find((e) => e !== undefined);
      if (passedOn !== undefined) return { error: new HostError(passedOn.code) };
    }
    const shape =
      errorShape === "data-type"
        ? dataTypeErrorCell
        : errorShape === "error-object"
          ? errorCell
          : (code: string) => errorCellFor(metadata, code);
    const passed = padded.map((arg) => asPassed(arg, shape));
    try {
      const value = handler(...passed);
      if (value instanceof HostError) return { error: value };
      return { value: value as CellResult };
    } catch (error) {
      if (error instanceof HostError) return { error };
      // The host turns any other exception into a bare #VALUE!, with no message.
      return { error: new HostError(ErrorCode.invalidValue, undefined) };
    }
  }
  const byId = (context as { echolotCellFunctions?: LoadedAddIn["byId"] }).echolotCellFunctions;
  if (byId === undefined) throw new Error("functions.js put no echolotCellFunctions registry");
  return { registered, metadata, invoke, byId };
}

/** The spilled value of an invocation, or a thrown description of the error it gave. */
export function spilled(result: Invocation, what: string): CellResult {
  if ("error" in result) {
    throw new Error(`${what} gave ${result.error.code}: ${result.error.message ?? "(no message)"}`);
  }
  return result.value;
}

/** A column range as the host passes it: one cell per row. */
export function columnRange(cells: readonly unknown[]): unknown[][] {
  return cells.map((cell) => [cell]);
}

/** A row range as the host passes it: one row of cells. */
export function rowRange(cells: readonly unknown[]): unknown[][] {
  return [[...cells]];
}

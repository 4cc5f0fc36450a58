/**
 * The one failure type of the core.
 *
 * Edge-case policy (applied everywhere): a single quantity the mathematics leaves undefined, such
 * as a lag with no available pairs, is `NaN`; a condition that makes the whole request meaningless
 * (bad argument, text in the data, zero variance, too few values) throws an `EcholotError`.
 *
 * - `invalid`: the user must change something (the spreadsheet shows #VALUE!, the CLI exits 2);
 * - `short`: there is not enough data for the computation (#N/A in the spreadsheet).
 */
export type EcholotErrorKind = "invalid" | "short";

/** The core's names of the arguments its refusals can be about. */
export type ParameterName =
  | "maxLag"
  | "lags"
  | "alpha"
  | "season"
  | "fittedParams"
  | "bandKind"
  | "testKind"
  | "horizon"
  | "hacLags"
  | "window"
  | "step";

/**
 * The argument a refusal is about, by the core's name for it, with what it allows: a whole number
 * from `low` to `high` (none when `high` < `low`), a number strictly between `low` and `high`, one
 * of `words`, or any number (an edge refused something that is not one). Each edge spells the
 * name as its users typed it (`--lags`, `lags`, "Max lag") instead of reading the message text.
 */
export type RefusedParameter = { readonly name: ParameterName } & (
  | { readonly allows: "whole"; readonly low: number; readonly high: number }
  | { readonly allows: "between"; readonly low: number; readonly high: number }
  | { readonly allows: "word"; readonly words: readonly string[] }
  | { readonly allows: "number" }
);

export class EcholotError extends Error {
  readonly kind: EcholotErrorKind;
  /** The argument refused, when the refusal is about one: the message starts with its name. */
  readonly parameter: RefusedParameter | undefined;

  constructor(kind: EcholotErrorKind, message: string, parameter?: RefusedParameter) {
    super(message);
    // Edges replace the leading name with their own spelling of it (`messageNaming`).
    if (parameter !== undefined && !message.startsWith(`${parameter.name} `)) {
      throw new Error(`a refusal of ${parameter.name} must start with its name: "${message}"`);
    }
    this.name = "EcholotError";
    this.kind = kind;
    this.parameter = parameter;
  }

  /**
   * The message with the refused argument named `spelling`, an edge's word for it ("--lags",
   * "Max lag"), instead of the core's name; the message as it is when no argument is refused.
   */
  messageNaming(spelling: string): string {
    if (this.parameter === undefined) return this.message;
    return `${spelling}${this.message.slice(this.parameter.name.length)}`;
  }
}

/** Throws an `invalid` EcholotError about the argument `parameter`: its message starts with its name. */
export function refuseParameter(parameter: RefusedParameter, message: string): never {
  throw new EcholotError("invalid", message, parameter);
}

/** Throws an `invalid` EcholotError with the message: the user has to fix the input. */
export function invalid(message: string): never {
  throw new EcholotError("invalid", message);
}

/**
 * `value` when it is a whole number from `low` to `high`; otherwise throws an `invalid`
 * EcholotError with the message `describe()` writes and the parameter with its range. The one
 * whole-number check of the core: a negated comparison, so NaN, ±Infinity, fractions and
 * non-numbers are all refused.
 */
export function requireWholeNumber(
  name: ParameterName,
  value: unknown,
  low: number,
  high: number,
  describe: () => string,
): number {
  if (!(Number.isInteger(value) && (value as number) >= low && (value as number) <= high)) {
    refuseParameter({ name, allows: "whole", low, high }, describe());
  }
  return value as number;
}

/** Throws a `short` EcholotError with the message: there are too few values. */
export function tooShort(message: string): never {
  throw new EcholotError("short", message);
}

export function isEcholotError(error: unknown): error is EcholotError {
  return error instanceof EcholotError;
}

/**
 * The result of `compute`, or the message of the EcholotError it threw: for side checks that a
 * report shows when the data support them and explains when they do not. Other errors propagate.
 */
export function resultOrReason<T>(compute: () => T): T | string {
  try {
    return compute();
  } catch (error) {
    if (isEcholotError(error)) return error.message;
    throw error;
  }
}

/**
 * The one wrapper every cell function runs its body through: it turns the core's refusals into
 * the host's error values, the only two that show a message — `invalid` (the user must change
 * something) becomes #VALUE!, `short` (not enough data) becomes #N/A. Anything else is a bug of
 * ours; it still reaches the cell as #VALUE! with its message rather than as a bare error.
 */
import { isEcholotError } from "../src/core";
import type { ArgumentNames } from "./arguments";

function hostError(error: unknown, names: ArgumentNames): CustomFunctions.Error {
  if (error instanceof CustomFunctions.Error) return error;
  if (isEcholotError(error)) {
    const code =
      error.kind === "short"
        ? CustomFunctions.ErrorCode.notAvailable
        : CustomFunctions.ErrorCode.invalidValue;
    const argument = error.parameter === undefined ? undefined : names[error.parameter.name];
    return new CustomFunctions.Error(
      code,
      argument === undefined ? error.message : error.messageNaming(argument),
    );
  }
  const message = error instanceof Error ? error.message : String(error);
  return new CustomFunctions.Error(
    CustomFunctions.ErrorCode.invalidValue,
    `Echolot could not compute this (${message}); please report it with the data that caused it`,
  );
}

/**
 * Runs `body` and throws any failure as the matching host error; a refused argument is named as
 * the function names it (`names`, where that differs from the core's name).
 */
export function cellFunction<T>(body: () => T, names: ArgumentNames = {}): T {
  try {
    return body();
  } catch (error) {
    throw hostError(error, names);
  }
}

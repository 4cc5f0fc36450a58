/**
 * Options of the lag analysis, their keywords and their validation. One place decides what is
 * allowed and what the message says, for the cell functions, the pane and the CLI alike. Checks
 * use negated comparisons (`!(x >= 1)`) so that NaN is refused too.
 */
import { defaultMaxLag } from "./defaultLags";
import { refuseParameter, requireWholeNumber, tooShort, type ParameterName } from "./errors";
import { BAND_KINDS, TEST_KINDS, type BandKind, type Series, type TestKind } from "./types";

/** Options as a caller gives them; `null` or absent means "use the default". */
export interface LagOptions {
  readonly maxLag?: number | null;
  readonly alpha?: number | null;
  readonly season?: number | null;
  readonly fittedParams?: number | null;
  readonly bandKind?: BandKind | null;
  readonly testKind?: TestKind | null;
}

export interface ResolvedLagOptions {
  readonly maxLag: number;
  readonly alpha: number;
  readonly season: number | null;
  readonly fittedParams: number;
  readonly bandKind: BandKind;
  readonly testKind: TestKind;
}

export const DEFAULT_ALPHA = 0.05;

function values(n: number): string {
  return `${n} value${n === 1 ? "" : "s"}`;
}

/** Validates `alpha`: a number strictly between 0 and 1. */
export function resolveAlpha(alpha: number | null | undefined): number {
  if (alpha === null || alpha === undefined) return DEFAULT_ALPHA;
  if (!(alpha > 0 && alpha < 1)) {
    refuseParameter(
      { name: "alpha", allows: "between", low: 0, high: 1 },
      `alpha must be a number between 0 and 1, such as 0.05 (got ${alpha})`,
    );
  }
  return alpha;
}

/** Validates a whole-number lag count from 1 to n − 1, named `name` in the message. */
export function resolveLagCount(name: ParameterName, value: number, n: number): number {
  return requireWholeNumber(
    name,
    value,
    1,
    n - 1,
    () => `${name} must be a whole number from 1 to ${n - 1} (the series has ${values(n)})`,
  );
}

/**
 * A lag count as given, checked by `resolveLagCount`; absent (`null` or undefined), the default
 * of defaultLags.ts for n values and the season, if any.
 */
export function resolveLagCountOrDefault(
  name: ParameterName,
  value: number | null | undefined,
  n: number,
  season: number | null = null,
): number {
  return value === null || value === undefined
    ? defaultMaxLag(n, season)
    : resolveLagCount(name, value, n);
}

/** Validates the season length m: a whole number from 2 to n − 1. */
export function resolveSeason(season: number | null | undefined, n: number): number | null {
  if (season === null || season === undefined) return null;
  return requireWholeNumber(
    "season",
    season,
    2,
    n - 1,
    () =>
      `season must be a whole number from 2 to ${Math.max(2, n - 1)}, the number of periods in one cycle, such as 12 for monthly data (got ${season})`,
  );
}

/** Requires at least `needed` values present. */
export function requireValues(series: Series, needed: number, purpose: string): void {
  if (series.count < needed) {
    tooShort(`${purpose} needs at least ${values(needed)}; the series has ${values(series.count)}`);
  }
}

export function resolveLagOptions(series: Series, options: LagOptions = {}): ResolvedLagOptions {
  requireValues(series, 3, "a lag analysis");
  const n = series.count;
  const alpha = resolveAlpha(options.alpha);
  const season = resolveSeason(options.season, n);
  const maxLag = resolveLagCountOrDefault("maxLag", options.maxLag, n, season);
  const given = options.fittedParams ?? 0;
  const fittedParams = requireWholeNumber(
    "fittedParams",
    given,
    0,
    maxLag - 1,
    () =>
      `fittedParams must be a whole number from 0 to ${maxLag - 1}: the test's degrees of freedom, ${maxLag} lags minus the fitted parameters, must be at least 1 (got ${given})`,
  );
  return {
    maxLag,
    alpha,
    season,
    fittedParams,
    bandKind: options.bandKind ?? "noise",
    testKind: options.testKind ?? "ljung-box",
  };
}

function parseKeyword<T extends string>(
  name: ParameterName,
  allowed: readonly T[],
  text: unknown,
  fallback: T,
): T {
  if (text === null || text === undefined || text === "") return fallback;
  const found =
    typeof text === "string"
      ? allowed.find((word) => word === text.trim().toLowerCase())
      : undefined;
  if (found === undefined) {
    const got = typeof text === "string" ? `"${text}"` : String(text);
    refuseParameter(
      { name, allows: "word", words: allowed },
      `${name} must be one of ${quoteList(allowed)} (got ${got})`,
    );
  }
  return found;
}

function quoteList(words: readonly string[]): string {
  const quoted = words.map((w) => `"${w}"`);
  return `${quoted.slice(0, -1).join(", ")} or ${quoted[quoted.length - 1]}`;
}

/** Reads a `bandKind` keyword, case-insensitively; blank means "noise". */
export function parseBandKind(text: unknown): BandKind {
  return parseKeyword("bandKind", BAND_KINDS, text, "noise");
}

/** Reads a `testKind` keyword, case-insensitively; blank means "ljung-box". */
export function parseTestKind(text: unknown): TestKind {
  return parseKeyword("testKind", TEST_KINDS, text, "ljung-box");
}

/**
 * The `check --json` document: the lag table's fields under stable names. Numbers keep full
 * precision (JSON.stringify writes the shortest round-trip form); an undefined figure (NaN) is
 * written as null, so every `number` below may be null in the text. Every document of the CLI
 * (check, batch, audit, fdr) starts with `version`, the JSON format's version (README, "JSON
 * documents"): it rises when a field is renamed or removed or changes meaning, not when one is
 * added.
 */
import type {
  BandKind,
  Headline,
  LagTable,
  PReference,
  ReferencedP,
  TestKind,
  VerdictLevels,
  VerdictWord,
} from "../core";
import { isPValueBound } from "../core";
import type { SideChecks } from "../report/sideChecks";

/**
 * The JSON format's version. 2: batch and audit entries in ranked order with `rank`, `position`
 * and `kept`, the joint-test statistic named `statistic` (it was `q`, beside `qValue`).
 */
export const JSON_VERSION = 2;

export interface LagJson {
  readonly lag: number;
  readonly corr: number;
  readonly partial: number;
  readonly band: number;
  /** The JSON key as published; the core's `crossesBand` (beyond the one-lag corridor). */
  readonly beyond: boolean;
  readonly z: number;
  readonly pLag: number;
  readonly pSidak: number;
  readonly pBound: boolean;
  readonly outer: boolean;
  readonly jointQ: number;
  readonly jointDf: number;
  readonly jointP: number;
  readonly jointPReference: "chi-square";
}

export interface ReferenceJson {
  readonly reference: PReference;
  readonly draws: number;
  readonly pBound: boolean;
}

/** The levels the verdict was judged at, under the core's names. */
export type LevelsJson = Pick<
  VerdictLevels,
  "reference" | "draws" | "structureLevel" | "criticalQ" | "outerLevel" | "watchLevel"
>;

export interface LagTableJson {
  readonly label: string;
  readonly n: number;
  readonly gaps: number;
  readonly maxLag: number;
  readonly alpha: number;
  readonly bandKind: BandKind;
  readonly testKind: TestKind;
  readonly season: number | null;
  readonly fittedParams: number;
  readonly mean: number;
  readonly variance: number;
  readonly innerLevel: number;
  readonly outerLevel: number;
  readonly lags: readonly LagJson[];
  /** The joint test over all K lags; `q` is its statistic (there is no q-value in this document). */
  readonly joint: {
    readonly test: string;
    readonly q: number;
    readonly df: number;
    readonly p: number;
    readonly reference: "chi-square";
    readonly pBound: boolean;
  };
  readonly verdictJoint: { readonly p: number } & ReferenceJson;
  readonly levels: LevelsJson;
  readonly jointLevel: number;
  readonly falseAlarm: {
    readonly tested: number;
    readonly expected: number;
    /** JSON keys as published; the core's `crossings` and `crossingLags`. */
    readonly beyond: number;
    readonly beyondLags: readonly number[];
    readonly chance: number;
  };
  readonly verdict: { readonly word: VerdictWord; readonly reason: string };
}

export function lagTableJson(table: LagTable): LagTableJson {
  return {
    label: table.label,
    n: table.n,
    gaps: table.gaps,
    maxLag: table.maxLag,
    alpha: table.alpha,
    bandKind: table.bandKind,
    testKind: table.testKind,
    season: table.season,
    fittedParams: table.fittedParams,
    mean: table.mean,
    variance: table.variance,
    innerLevel: table.innerLevel,
    outerLevel: table.outerLevel,
    lags: table.rows.map((row) => ({
      lag: row.lag,
      corr: row.correlation,
      partial: row.partial,
      band: row.band,
      beyond: row.crossesBand,
      z: row.z,
      pLag: row.pLag,
      pSidak: row.pSidak,
      pBound: isPValueBound(row.pLag),
      outer: row.outer,
      jointQ: row.jointQ,
      jointDf: row.jointDf,
      jointP: row.jointP,
      jointPReference: "chi-square",
    })),
    joint: {
      test: table.joint.test,
      q: table.joint.q,
      df: table.joint.df,
      p: table.joint.p,
      reference: "chi-square",
      pBound: isPValueBound(table.joint.p),
    },
    verdictJoint: { p: table.levels.jointP.p, ...referenceFields(table.levels.jointP) },
    levels: levelFields(table.levels),
    jointLevel: table.jointLevel,
    falseAlarm: {
      tested: table.falseAlarm.tested,
      expected: table.falseAlarm.expected,
      beyond: table.falseAlarm.crossings,
      beyondLags: table.falseAlarm.crossingLags,
      chance: table.falseAlarm.chance,
    },
    verdict: { word: table.verdict.word, reason: table.verdict.reason },
  };
}

/**
 * The side checks under the names the `check --json` document promises; a check the data could
 * not support is null, and its reason is listed under `notComputed`.
 */
export interface SideChecksJson {
  readonly volatility: {
    readonly lm: number;
    readonly df: number;
    readonly p: number;
    readonly mcleodLiQ: number;
    readonly mcleodLiP: number;
  } | null;
  readonly bias: {
    readonly mean: number;
    readonly se: number;
    readonly t: number;
    readonly p: number;
    readonly hacLags: number;
  } | null;
  readonly runs: {
    readonly runs: number;
    readonly expected: number;
    readonly z: number;
    readonly p: number;
  } | null;
  readonly normality: { readonly jb: number; readonly p: number } | null;
  /** Why a check is null, by its name; absent when every check was computed. */
  readonly notComputed?: Readonly<Record<string, string>>;
}

export function sideChecksJson(side: SideChecks): SideChecksJson {
  const notComputed: Record<string, string> = {};
  const field = <T, J>(name: string, value: T | string, shape: (v: T) => J): J | null => {
    if (typeof value !== "string") return shape(value);
    notComputed[name] = value;
    return null;
  };
  const document = {
    volatility: field("volatility", side.volatility, (v) => ({
      lm: v.lm,
      df: v.df,
      p: v.p,
      mcleodLiQ: v.mcleodLiQ,
      mcleodLiP: v.mcleodLiP,
    })),
    bias: field("bias", side.bias, (b) => ({
      mean: b.mean,
      se: b.se,
      t: b.t,
      p: b.p,
      hacLags: b.hacLags,
    })),
    runs: field("runs", side.runs, (r) => ({ runs: r.runs, expected: r.expected, z: r.z, p: r.p })),
    normality: field("normality", side.normality, (j) => ({ jb: j.jb, p: j.p })),
  };
  return Object.keys(notComputed).length > 0 ? { ...document, notComputed } : document;
}

/** The headline of `check --json` (core/headline.ts): the word, how it reads, every finding. */
export type HeadlineJson = Pick<
  Headline,
  "word" | "title" | "reading" | "switched" | "biased" | "volatile" | "findings" | "note"
>;

export function headlineJson(headline: Headline): HeadlineJson {
  const { word, title, reading, switched, biased, volatile, findings, note } = headline;
  return { word, title, reading, switched, biased, volatile, findings, note };
}

/** Where a p comes from: its reference, the draws behind it, and whether it is only a bound. */
export function referenceFields(rp: ReferencedP): ReferenceJson {
  return { reference: rp.reference, draws: rp.draws, pBound: rp.bound || isPValueBound(rp.p) };
}

/** The levels the verdict was judged at. */
export function levelFields(levels: VerdictLevels): LevelsJson {
  return {
    reference: levels.reference,
    draws: levels.draws,
    structureLevel: levels.structureLevel,
    criticalQ: levels.criticalQ,
    outerLevel: levels.outerLevel,
    watchLevel: levels.watchLevel,
  };
}

/**
 * The whole `check --json` document, in the order written: `version`, `source` (what was read),
 * the headline, the lag table's fields, then the side checks'.
 */
export type CheckJson = {
  readonly version: number;
  readonly source: string;
  readonly headline: HeadlineJson;
} & LagTableJson &
  SideChecksJson;

/** The `check --json` document of a lag table (the reading shown), its headline and side checks. */
export function checkJson(
  source: string,
  headline: Headline,
  table: LagTable,
  side: SideChecks,
): CheckJson {
  return {
    version: JSON_VERSION,
    source,
    headline: headlineJson(headline),
    ...lagTableJson(table),
    ...sideChecksJson(side),
  };
}

/** JSON text with NaN and ±Infinity written as null. */
export function toJsonText(document: unknown): string {
  return JSON.stringify(
    document,
    (_key, value: unknown) => (typeof value === "number" && !Number.isFinite(value) ? null : value),
    2,
  );
}

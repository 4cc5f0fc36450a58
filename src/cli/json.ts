/**
 * The `check --json` document: the lag table's fields under stable names. Numbers keep full
 * precision (JSON.stringify writes the shortest round-trip form); an undefined figure (NaN) is
 * written as null.
 */
import type { LagTable } from "../core";

export function lagTableJson(table: LagTable): Record<string, unknown> {
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
      beyond: row.beyond,
      z: row.z,
      pLag: row.pLag,
      pSidak: row.pSidak,
      outer: row.outer,
      jointQ: row.jointQ,
      jointDf: row.jointDf,
      jointP: row.jointP,
    })),
    joint: { test: table.joint.test, q: table.joint.q, df: table.joint.df, p: table.joint.p },
    falseAlarm: {
      tested: table.falseAlarm.tested,
      expected: table.falseAlarm.expected,
      beyond: table.falseAlarm.beyond,
      beyondLags: table.falseAlarm.beyondLags,
      chance: table.falseAlarm.chance,
    },
    verdict: { word: table.verdict.word, reason: table.verdict.reason },
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

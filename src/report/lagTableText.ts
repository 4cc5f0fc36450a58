/**
 * The lag table as fixed-width text, for the terminal, in Echolot's own reading of a lag: its z,
 * the corridor that holds it, its p alone and for all K lags together; the correlations follow.
 * The joint test over lags 1..k is not a figure of lag k, so it is a separate view,
 * `jointSpanText`: one row per span of lags. Figures are rounded for reading only; the JSON output
 * keeps full precision.
 */
import { formatP, referencedPPhrase, seriesName, type LagTable } from "../core";
import { jointTestName, viewBandWords } from "./lagViews";
import { ZONE_SHORT } from "./palette";
import { paddedNumber, paddedP } from "./tableCells";
import { BADGES, SCREENING_CAUTION } from "./verdictBadge";

/** The series' lines, the per-lag rows, the joint test at the chosen K and the verdict. */
export function lagTableText(table: LagTable): string {
  const badge = BADGES[table.verdict.word];
  const K = table.maxLag;
  const name = seriesName(table.label, "cell");
  const lines: string[] = [];
  lines.push(
    `${name}: n = ${table.n}, gaps ${table.gaps}, mean ${table.mean.toPrecision(6)}, variance ${table.variance.toPrecision(6)}`,
  );
  lines.push(
    `z against ${viewBandWords(table, "correlation")}, alpha ${table.alpha}` +
      `${table.fittedParams > 0 ? `, ${table.fittedParams} fitted parameters` : ""}` +
      `${table.season === null ? "" : `, season ${table.season}`}`,
  );
  lines.push(
    `corridors in z: one lag ±${table.innerLevel.toFixed(3)}, all ${K} lags ±${table.outerLevel.toFixed(3)}`,
  );
  lines.push("");
  lines.push("  lag       z  corridor   p one lag  p all lags   autocorr   partial");
  lines.push("                                     (Šidák)");
  for (const row of table.rows) {
    lines.push(
      [
        String(row.lag).padStart(5),
        paddedNumber(row.z, 2, 7),
        ` ${ZONE_SHORT[row.zone].padEnd(8)}`,
        paddedP(row.pLag, 11),
        paddedP(row.pSidak, 11),
        paddedNumber(row.correlation, 4, 10),
        paddedNumber(row.partial, 4, 9),
      ].join(" "),
    );
  }
  lines.push("");
  lines.push(
    `joint test ${jointTestName(table)}, lags 1–${K}: Q = ${table.joint.q.toFixed(4)}, df ${table.joint.df}, χ² p = ${formatP(table.joint.p)}`,
  );
  lines.push(`  as the verdict reads it: ${referencedPPhrase(table.levels.jointP)}`);
  lines.push(`verdict: ${badge.shape} ${badge.word}`);
  lines.push(`  ${table.verdict.reason}`);
  lines.push("");
  lines.push(SCREENING_CAUTION);
  return lines.join("\n");
}

/**
 * The joint test by lag span: one row per k = 1..K with the test over lags 1..k (what the ribbon
 * draws as cells), the chosen K marked as the verdict's.
 */
export function jointSpanText(table: LagTable): string {
  const lines = [
    `joint test by lag span: ${jointTestName(table)} over lags 1..k (the verdict reads k = ${table.maxLag})`,
    "  lags          Q   df       χ² p",
  ];
  for (const row of table.rows) {
    lines.push(
      [
        `1–${row.lag}`.padStart(6),
        paddedNumber(row.jointQ, 2, 10),
        (Number.isNaN(row.jointP) ? "—" : String(row.jointDf)).padStart(4),
        paddedP(row.jointP, 10),
        row.lag === table.maxLag ? " ← verdict" : "",
      ]
        .join(" ")
        .trimEnd(),
    );
  }
  return lines.join("\n");
}

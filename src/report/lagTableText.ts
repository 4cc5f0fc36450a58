/**
 * The lag table as fixed-width text, for the terminal. Figures are rounded for reading only; the
 * JSON output keeps full precision.
 */
import { formatP, TEST_NAMES, type LagTable } from "../core";
import { numberCell, pCell } from "./tableCells";
import { BADGES, SCREENING_CAUTION } from "./verdictBadge";

export function lagTableText(table: LagTable): string {
  const badge = BADGES[table.verdict.word];
  const lines: string[] = [];
  const name = table.label === "" ? "series" : table.label;
  lines.push(
    `${name}: n = ${table.n}, gaps ${table.gaps}, mean ${table.mean.toPrecision(6)}, variance ${table.variance.toPrecision(6)}`,
  );
  lines.push(
    `bands: ${table.bandKind}, alpha ${table.alpha}; joint test: ${TEST_NAMES[table.testKind]}` +
      `${table.fittedParams > 0 ? `, ${table.fittedParams} fitted parameters` : ""}` +
      `${table.season === null ? "" : `; season ${table.season}`}`,
  );
  lines.push(
    `corridors: one lag ±${table.innerLevel.toFixed(3)}, all ${table.maxLag} lags ±${table.outerLevel.toFixed(3)} (in z units)`,
  );
  lines.push("");
  lines.push(
    "  lag     corr  partial     band       z   p(lag)  p(all K)        Q  df  p(joint)  mark",
  );
  for (const row of table.rows) {
    const mark = row.outer ? "beyond all-lags corridor" : row.beyond ? "beyond band" : "";
    lines.push(
      [
        String(row.lag).padStart(5),
        numberCell(row.correlation, 4, 8),
        numberCell(row.partial, 4, 8),
        numberCell(row.band, 4, 8),
        numberCell(row.z, 2, 7),
        pCell(row.pLag, 8),
        pCell(row.pSidak, 9),
        numberCell(row.jointQ, 2, 8),
        String(row.jointDf).padStart(3),
        pCell(row.jointP, 9),
        ` ${mark}`,
      ].join(" "),
    );
  }
  lines.push("");
  lines.push(
    `joint: ${TEST_NAMES[table.joint.test]} Q = ${table.joint.q.toFixed(4)}, df ${table.joint.df}, p = ${formatP(table.joint.p)}`,
  );
  lines.push(`verdict: ${badge.shape} ${badge.word}`);
  lines.push(`  ${table.verdict.reason}`);
  lines.push("");
  lines.push(SCREENING_CAUTION);
  return lines.join("\n");
}

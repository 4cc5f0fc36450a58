/**
 * The lag table as fixed-width text, for the terminal. Figures are rounded for reading only; the
 * JSON output keeps full precision.
 */
import { formatP, isPValueBound, TEST_NAMES, type LagTable } from "../core";
import { BADGES, SCREENING_CAUTION } from "./verdictBadge";

function fixed(x: number, digits: number, width: number): string {
  const text = Number.isFinite(x) ? x.toFixed(digits) : "—";
  return text.padStart(width);
}

function pText(p: number, width: number): string {
  if (Number.isNaN(p)) return "—".padStart(width);
  if (isPValueBound(p)) return "<1e-300".padStart(width);
  return (p >= 0.0001 ? p.toFixed(4) : p.toExponential(1)).padStart(width);
}

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
        fixed(row.correlation, 4, 8),
        fixed(row.partial, 4, 8),
        fixed(row.band, 4, 8),
        fixed(row.z, 2, 7),
        pText(row.pLag, 8),
        pText(row.pSidak, 9),
        fixed(row.jointQ, 2, 8),
        String(row.jointDf).padStart(3),
        pText(row.jointP, 9),
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

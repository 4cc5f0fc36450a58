/**
 * The forecast audit of one or many error series as fixed-width text for the terminal: per series
 * the bias (mean, Newey–West se, t, p and its q-value across the series), the lags below the
 * horizon that h-step errors are expected to carry (shown, not counted), the joint test of the
 * lags from h on with its q-value, and the verdict; then the reasons of every series that is not
 * clear, and the raw and false-discovery-rate counts for dependence and for bias.
 */
import {
  formatNumber,
  rankedAuditItems,
  type AuditBatch,
  type AuditBatchItem,
  type ForecastAudit,
} from "../core";
import { BADGES, SCREENING_CAUTION } from "./verdictBadge";
import { figureCell, numberCell, pCell } from "./tableCells";

export function auditText(batch: AuditBatch, horizon: number, season: number | null): string {
  const { alpha } = batch;
  const width = batch.items.reduce((w, item) => Math.max(w, item.label.length), 6);
  const first = batch.items
    .map((item) => item.audit)
    .find((audit): audit is ForecastAudit => audit !== null);
  const lines: string[] = [];
  const expectedLags =
    horizon === 1
      ? "one-step errors: every lag counts"
      : `${horizon}-step errors: lags 1–${horizon - 1} are expected to be non-zero and are shown, not counted`;
  lines.push(
    `forecast audit: horizon ${horizon} (${expectedLags}); Bartlett bands; alpha ${alpha}${season === null ? "" : `; season ${season}`}`,
  );
  if (first !== undefined) {
    const audits = batch.items.flatMap((item) => (item.audit === null ? [] : [item.audit]));
    const spread = (pick: (audit: ForecastAudit) => number) => {
      let lo = Infinity;
      let hi = -Infinity;
      for (const audit of audits) {
        lo = Math.min(lo, pick(audit));
        hi = Math.max(hi, pick(audit));
      }
      return lo === hi ? String(lo) : `${lo}–${hi}`;
    };
    const test = horizon === 1 ? "Ljung–Box" : `Ljung–Box adjusted for the ${horizon}-step horizon`;
    lines.push(
      `dependence: joint test of lags ${horizon} to ${spread((a) => a.maxLag)} (${test}); bias: corrected t with the long-run variance over lags 0–${horizon - 1}, against t with n − 1 df; dependence p by Monte Carlo under the fitted MA(${horizon - 1}) null`,
    );
  }
  lines.push("");
  const expectedHeader =
    horizon === 1 ? "" : `  r(1..${horizon - 1})`.padEnd(8 + 6 * (horizon - 1));
  lines.push(
    `${"series".padEnd(width)}      n        mean       se       t  p(bias)  q(bias)${expectedHeader}  lags        Q  df   p(dep)   q(dep)  verdict`,
  );
  const ranked = rankedAuditItems(batch);
  for (const item of ranked) lines.push(row(item, width, horizon));
  lines.push("");
  const analysed = batch.items.filter((item) => item.audit !== null).length;
  lines.push(
    `dependence: raw p < ${alpha} flags ${batch.flaggedRaw} of ${analysed}; false-discovery rate ${alpha} keeps ${batch.flaggedFdr} (about ${formatNumber(analysed * alpha, 2)} raw flags expected by chance if every forecast were sound).`,
  );
  lines.push(
    `bias: raw p < ${alpha} flags ${batch.biasFlaggedRaw} of ${analysed}; false-discovery rate ${alpha} keeps ${batch.biasFlaggedFdr}.`,
  );
  lines.push(
    `Only kept items are called structure or biased; a finding the false-discovery step does not keep is at most watch. Ranked: kept findings first, then watch, clear.`,
  );
  const notes = ranked.filter(
    (item) => item.headline === null || item.headline.word !== "clear" || item.headline.biased,
  );
  if (notes.length > 0) {
    lines.push("");
    for (const item of notes) {
      const { headline } = item;
      if (headline === null) {
        lines.push(`${item.label}: not audited: ${item.problem}`);
      } else {
        lines.push(
          `${item.label}: ${BADGES[headline.word].shape} ${headline.title}: ${headline.finding}`,
        );
      }
    }
  }
  lines.push("");
  lines.push(SCREENING_CAUTION);
  return lines.map((line) => line.trimEnd()).join("\n");
}

function row(item: AuditBatchItem, width: number, horizon: number): string {
  const audit = item.audit;
  const label = item.label.padEnd(width);
  if (audit === null) return `${label}  — not audited (see below)`;
  const { bias, dependenceTest } = audit;
  const expected =
    horizon === 1
      ? ""
      : ` ${audit.rows
          .filter((r) => !r.counted)
          .map((r) => numberCell(r.correlation, 2, 5))
          .join(" ")}`.padEnd(8 + 6 * (horizon - 1));
  const headline = item.headline;
  const badge = headline === null ? "" : `${BADGES[headline.word].shape} ${headline.title}`;
  return [
    label,
    String(audit.n).padStart(6),
    figureCell(bias.mean, 4, 11),
    figureCell(bias.se, 3, 8),
    numberCell(bias.tCorrected, 2, 7),
    pCell(bias.p, 8),
    pCell(item.biasQValue, 8),
    expected,
    `${dependenceTest.firstLag}–${dependenceTest.maxLag}`.padStart(5),
    numberCell(dependenceTest.q, 2, 8),
    String(dependenceTest.df).padStart(3),
    pCell(audit.levels.jointP.p, 8),
    pCell(item.dependenceQValue, 8),
    ` ${badge}`,
  ].join(" ");
}

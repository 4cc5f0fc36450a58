/**
 * `echolot demo`: the main job on each demo scenario. A scenario of many series is read as a
 * batch — ranked, with each series' headline across the batch (structure only when kept by the
 * false-discovery step, biased when the bias step keeps it); a scenario of one series gets its
 * headline, then the readings the scenario compares, side by side.
 */
import { join } from "node:path";
import {
  batchCheck,
  formatP,
  noiseCheck,
  rankedRows,
  seriesHeadline,
  type Headline,
  type Series,
} from "../core";
import { BADGES, SCREENING_CAUTION } from "../report";
import { readingFrom } from "./csv";
import { readManySeries } from "./input";
import { DEMO_SCENARIOS, demoDirectory, type DemoScenario } from "./scenarios";

export async function runDemo(): Promise<string> {
  const lines: string[] = [];
  for (const scenario of DEMO_SCENARIOS) {
    const file = join(demoDirectory(), scenario.file);
    lines.push(scenario.title, `  ${scenario.story}`, `  file: ${file}`, "");
    const { series } = await readManySeries(readingFrom(file, {}), {});
    const shown = series.length > 1 ? batchLines(scenario, series) : oneLines(scenario, series);
    for (const line of shown) lines.push(line);
    lines.push("");
  }
  lines.push(SCREENING_CAUTION);
  return lines.join("\n");
}

function headlineCell(headline: Headline): string {
  return `${BADGES[headline.word].shape} ${headline.title}`;
}

/** The ranked batch: one line per series, the headline and its first sentence. */
function batchLines(scenario: DemoScenario, series: readonly Series[]): string[] {
  const options = scenario.readings[0]?.options ?? {};
  const batch = batchCheck(series, options);
  const width = batch.rows.reduce((w, row) => Math.max(w, row.label.length), 0);
  const lines = [
    `  ${scenario.readings[0]?.name ?? "default options"}; ranked, the ones to look at first on top (p: structure p; q: its q-value across the ${batch.analysed} series)`,
  ];
  for (const row of rankedRows(batch)) {
    const headline = row.headline;
    if (headline === null) {
      lines.push(`  ${row.label.padEnd(width)}  — not analysed: ${row.reason}`);
      continue;
    }
    lines.push(
      `  ${row.label.padEnd(width)}  ${headlineCell(headline).padEnd(24)} p = ${formatP(row.p).padEnd(8)} q = ${formatP(row.qValue).padEnd(8)} ${headline.findings.join(" ")}`,
    );
  }
  lines.push(
    `  ${batch.flaggedFdr} kept for lag structure and ${batch.biasFlaggedFdr} for bias after the false-discovery step (${batch.flaggedRaw} with raw p < ${batch.alpha}).`,
  );
  return lines;
}

/** One series: its headline, then each reading the scenario compares. */
function oneLines(scenario: DemoScenario, series: readonly Series[]): string[] {
  const lines: string[] = [];
  for (const one of series) {
    const { headline } = seriesHeadline(one, {});
    lines.push(`  headline: ${headlineCell(headline)}`);
    for (const finding of headline.findings) lines.push(`    ${finding}`);
    lines.push("", "  the readings side by side:");
    for (const reading of scenario.readings) {
      const check = noiseCheck(one, reading.options);
      const badge = BADGES[check.verdict.word];
      lines.push(
        `  ${reading.name.padEnd(32)} ${badge.shape} ${badge.word.padEnd(9)} p = ${formatP(check.levels.jointP.p).padEnd(8)} ${check.verdict.finding}`,
      );
    }
  }
  return lines;
}

/** `echolot demo`: the verdict of every series of every demo scenario. */
import { join } from "node:path";
import { formatP, noiseCheck } from "../core";
import { BADGES, SCREENING_CAUTION } from "../report";
import { readingFrom } from "./csv";
import { readManySeries } from "./input";
import { DEMO_SCENARIOS, demoDirectory } from "./scenarios";

export async function runDemo(): Promise<string> {
  const lines: string[] = [];
  for (const scenario of DEMO_SCENARIOS) {
    const file = join(demoDirectory(), scenario.file);
    lines.push(scenario.title, `  ${scenario.story}`, `  file: ${file}`, "");
    const { series } = await readManySeries(readingFrom(file, {}), {});
    const width = series.reduce((w, s) => Math.max(w, s.label.length), 0);
    for (const reading of scenario.readings) {
      if (scenario.readings.length > 1) lines.push(`  reading: ${reading.name}`);
      for (const one of series) {
        const check = noiseCheck(one, reading.options);
        const badge = BADGES[check.verdict.word];
        lines.push(
          `  ${one.label.padEnd(width)}  ${badge.shape} ${badge.word.padEnd(9)} p = ${formatP(check.joint.p).padEnd(8)} ${check.verdict.reason}`,
        );
      }
      lines.push("");
    }
  }
  lines.push(SCREENING_CAUTION);
  return lines.join("\n");
}

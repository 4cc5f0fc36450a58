/**
 * A vitest reporter that prints, after the run, the slowest test files: the time each took to
 * import and to run its tests and hooks, and its share of the summed file time. With several
 * workers the files overlap, so the shares say where the run's work goes, not its wall time.
 */
import type { Reporter, TestModule } from "vitest/node";

/** How many files the table lists. */
const SHOWN = 12;

function seconds(ms: number): string {
  return `${(ms / 1000).toFixed(1).padStart(7)} s`;
}

export default class SlowestFiles implements Reporter {
  onTestRunEnd(testModules: readonly TestModule[]): void {
    const files = testModules.map((module) => {
      const diagnostic = module.diagnostic();
      const total = diagnostic.collectDuration + diagnostic.duration;
      return { name: module.relativeModuleId, total, imports: diagnostic.collectDuration };
    });
    if (files.length === 0) return;
    files.sort((a, b) => b.total - a.total);
    const sum = files.reduce((s, file) => s + file.total, 0);
    const lines = [
      "",
      `Slowest test files (import + tests; all ${files.length} files sum to ${seconds(sum).trim()}):`,
    ];
    for (const file of files.slice(0, SHOWN)) {
      const share = `${((100 * file.total) / sum).toFixed(1).padStart(5)}%`;
      lines.push(
        `${seconds(file.total)} ${share}  ${file.name}  (import ${seconds(file.imports).trim()})`,
      );
    }
    process.stdout.write(`${lines.join("\n")}\n`);
  }
}

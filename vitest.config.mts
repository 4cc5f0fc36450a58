import { existsSync } from "node:fs";
import { availableParallelism } from "node:os";
import { relative } from "node:path";
import { configDefaults, defineConfig } from "vitest/config";
import { BaseSequencer, type TestSpecification } from "vitest/node";

/**
 * The browser tests drive Debian's Chromium. They always run in CI (CI=true; a missing Chromium
 * then fails them) and wherever Chromium is installed; elsewhere they are left out, and the run
 * says so plainly.
 */
const chromium = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";
const browserTests = existsSync(chromium) || process.env.CI === "true";
if (!browserTests) {
  console.log(
    `NOT RUN: the browser tests of the pane (test/browser): no Chromium at ${chromium}. ` +
      "Install it with `apt-get install -y chromium` (or set CHROMIUM_PATH) to run them.",
  );
}

/**
 * Orders the test files for the workers: longest first, so that no long file starts last and
 * runs alone at the end. Vitest does this from the durations it cached in an earlier run; without
 * them (a fresh clone: `npm ci` empties node_modules/.vite) it orders by file size, which would
 * start the short files of seeded simulations last. The files of test/calibration/ then go first.
 * (Defined here: the config loader reads plain modules best.)
 */
const SIMULATIONS = /[\\/]test[\\/]calibration[\\/]/;

class HeavyFirst extends BaseSequencer {
  override async sort(files: TestSpecification[]): Promise<TestSpecification[]> {
    const sorted = await super.sort(files);
    const cached = sorted.every((file) => {
      const key = `${file.project.name}:${relative(this.ctx.config.root, file.moduleId)}`;
      return this.ctx.cache.getFileTestResults(key) !== undefined;
    });
    if (cached) return sorted;
    const simulations = sorted.filter((file) => SIMULATIONS.test(file.moduleId));
    return [...simulations, ...sorted.filter((file) => !SIMULATIONS.test(file.moduleId))];
  }
}

export default defineConfig({
  test: {
    include: ["test/**/*.test.ts"],
    exclude: browserTests ? configDefaults.exclude : [...configDefaults.exclude, "test/browser/**"],
    // The builds are made once by `npm test` before vitest starts; this checks they are current.
    globalSetup: ["test/runner/freshBuilds.ts"],
    // One worker per core: the main process mostly waits, and vitest's default (cores − 1) would
    // run the files one after another on a 2-core machine.
    maxWorkers: availableParallelism(),
    sequence: { sequencer: HeavyFirst },
    // Sized for a 2-core machine that other work keeps busy (several times slower than idle): the
    // longest ordinary test takes about 10 s there. Heavier tests state their own timeouts.
    testTimeout: 120_000,
    hookTimeout: 240_000,
    reporters: ["default", "./test/runner/slowestFiles.ts"],
  },
});

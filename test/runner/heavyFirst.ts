/**
 * Orders the test files for the workers: longest first, so that no long file starts last and
 * runs alone at the end. Vitest does this from the durations it cached in an earlier run; without
 * them (a fresh clone: `npm ci` empties node_modules/.vite) it orders by file size, which would
 * start the short files of seeded simulations last. The files of test/calibration/ then go first.
 */
import { relative } from "node:path";
import { BaseSequencer, type TestSpecification } from "vitest/node";

const SIMULATIONS = /[\\/]test[\\/]calibration[\\/]/;

export default class HeavyFirst extends BaseSequencer {
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

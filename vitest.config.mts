import { existsSync } from "node:fs";
import { configDefaults, defineConfig } from "vitest/config";

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

export default defineConfig({
  test: {
    include: ["test/**/*.test.ts"],
    exclude: browserTests ? configDefaults.exclude : [...configDefaults.exclude, "test/browser/**"],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    reporters: ["default"],
  },
});

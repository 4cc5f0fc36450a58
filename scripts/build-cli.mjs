// Bundles the CLI, the demo generator and the demo workbook writer into self-contained CommonJS
// files under build/, so `npx echolot` works right after `npm ci` (the `prepare` script runs this).
import { build } from "esbuild";

const common = {
  bundle: true,
  platform: "node",
  target: "node20",
  format: "cjs",
  logLevel: "warning",
};

await build({
  ...common,
  entryPoints: ["src/cli/main.ts"],
  outfile: "build/echolot.cjs",
  // `workbook` loads these from node_modules when it runs; the other commands never need them.
  external: ["exceljs", "jszip"],
  banner: { js: "#!/usr/bin/env node" },
});
await build({
  ...common,
  entryPoints: ["scripts/generate-demo.ts"],
  outfile: "build/generate-demo.cjs",
});
await build({
  ...common,
  entryPoints: ["scripts/build-demo-workbook.ts"],
  outfile: "build/build-demo-workbook.cjs",
});

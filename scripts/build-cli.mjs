// Bundles the CLI, the demo generator and the demo workbook writer into self-contained CommonJS
// files under build/, so `npx echolot` works right after `npm ci` (the `prepare` script runs this).
import { writeFileSync } from "node:fs";
import { build } from "esbuild";

const common = {
  bundle: true,
  platform: "node",
  target: "node20",
  format: "cjs",
  logLevel: "warning",
  metafile: true,
};

/**
 * Bundles into build/NAME.cjs and lists the project's files that went in beside it
 * (build/NAME.inputs.json), so the tests can refuse a bundle older than one of them.
 */
async function bundle(name, options) {
  const result = await build({ ...common, ...options, outfile: `build/${name}.cjs` });
  const inputs = Object.keys(result.metafile.inputs)
    .filter((file) => !file.startsWith("node_modules/"))
    .sort();
  writeFileSync(`build/${name}.inputs.json`, `${JSON.stringify(inputs, null, 2)}\n`);
}

await bundle("echolot", {
  entryPoints: ["src/cli/main.ts"],
  // `workbook` loads these from node_modules when it runs; the other commands never need them.
  external: ["exceljs", "jszip"],
  banner: { js: "#!/usr/bin/env node" },
});
await bundle("generate-demo", { entryPoints: ["scripts/generate-demo.ts"] });
await bundle("build-demo-workbook", { entryPoints: ["scripts/build-demo-workbook.ts"] });

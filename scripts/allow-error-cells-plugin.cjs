/**
 * Webpack step: adds `"allowErrorForDataTypeAny": true` to the functions.json that the metadata
 * plugin generates. The JSDoc generator never writes this flag; without it the host answers a
 * formula whose range holds an error value with that error, without calling the function, so a
 * #N/A gap could never reach the intake. Runs at the asset "additional" stage, after the metadata
 * plugin has put functions.json into the compilation, and replaces the asset through webpack's
 * API rather than editing the emitted file.
 */
/* eslint-disable @typescript-eslint/no-require-imports -- a CommonJS file, loaded by webpack-cli */
const { Compilation, sources, WebpackError } = require("webpack");

const PLUGIN_NAME = "AllowErrorCellsPlugin";

class AllowErrorCellsPlugin {
  /** @param {{ file?: string }} [options] */
  constructor(options = {}) {
    this.file = options.file ?? "functions.json";
  }

  /** @param {import("webpack").Compiler} compiler */
  apply(compiler) {
    compiler.hooks.thisCompilation.tap(PLUGIN_NAME, (compilation) => {
      compilation.hooks.processAssets.tap(
        { name: PLUGIN_NAME, stage: Compilation.PROCESS_ASSETS_STAGE_ADDITIONAL },
        () => {
          const asset = compilation.getAsset(this.file);
          if (asset === undefined) {
            // The metadata plugin reports its own errors; only flag a silent absence.
            if (compilation.errors.length === 0) {
              compilation.errors.push(new WebpackError(`${PLUGIN_NAME}: no ${this.file} to amend`));
            }
            return;
          }
          const metadata = JSON.parse(asset.source.source().toString());
          const amended = { allowErrorForDataTypeAny: true, ...metadata };
          compilation.updateAsset(
            this.file,
            new sources.RawSource(`${JSON.stringify(amended, null, 2)}\n`),
          );
        },
      );
    });
  }
}

module.exports = { AllowErrorCellsPlugin };

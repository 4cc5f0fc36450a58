/**
 * Webpack step: adds `"allowErrorForDataTypeAny": true` to the functions.json that the metadata
 * plugin generates. The JSDoc generator never writes this flag; without it the host answers a
 * formula whose range holds an error value with that error, without calling the function, so a
 * #N/A gap could never reach the intake.
 *
 * The metadata plugin puts functions.json into every compilation when it is created, child
 * compilations included (html-webpack-plugin runs one), and a child's assets are merged into the
 * parent. So the flag is added at the same moment, in every compilation: all copies then carry
 * the same content and never clash ("multiple assets emit different content"), on the first
 * build and on every rebuild. List this plugin after the metadata plugin.
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
    compiler.hooks.compilation.tap(PLUGIN_NAME, (compilation) => {
      this.amend(compilation);
      if (compilation.compiler.isChild()) return;
      compilation.hooks.processAssets.tap(
        { name: PLUGIN_NAME, stage: Compilation.PROCESS_ASSETS_STAGE_REPORT },
        () => this.check(compilation),
      );
    });
  }

  /** @param {import("webpack").Compilation} compilation */
  amend(compilation) {
    const asset = compilation.getAsset(this.file);
    if (asset === undefined) return;
    const metadata = JSON.parse(asset.source.source().toString());
    if (metadata.allowErrorForDataTypeAny === true) return;
    const amended = { allowErrorForDataTypeAny: true, ...metadata };
    compilation.updateAsset(
      this.file,
      new sources.RawSource(`${JSON.stringify(amended, null, 2)}\n`),
    );
  }

  /** Fails the build when the emitted functions.json lacks the flag (plugin order, say). */
  check(compilation) {
    if (compilation.errors.length > 0) return; // the metadata plugin reports its own errors
    const asset = compilation.getAsset(this.file);
    const flagged =
      asset !== undefined &&
      JSON.parse(asset.source.source().toString()).allowErrorForDataTypeAny === true;
    if (!flagged) {
      compilation.errors.push(
        new WebpackError(
          `${PLUGIN_NAME}: ${this.file} is missing or lacks allowErrorForDataTypeAny; list this plugin after the custom-functions metadata plugin`,
        ),
      );
    }
  }
}

module.exports = { AllowErrorCellsPlugin };

/**
 * Builds the add-in into dist/: the functions bundle, functions.json (from the JSDoc of
 * functions/functions.ts, plus the allowErrorForDataTypeAny flag), taskpane.html with its bundle
 * and its Content-Security-Policy (scripts/content-policy.cjs), the manifest, icons and the
 * functions' help pages, and — in a local build — a copy of office.js.
 *
 * One page, one runtime: taskpane.html loads office.js, then both bundles, so the pane and the cell
 * functions share a runtime (the manifest's SharedRuntime).
 *
 * Where office.js comes from is the build switch `--env officeJs=cdn|local` (or OFFICE_JS=…):
 *   npm run build         production build for publishing: office.js from its CDN
 *   npm run build:local   production build with the local copy: tests, offline use
 *   npm start             dev server with the local copy, https on port 3000 (http on 127.0.0.1
 *                         as a fallback)
 *   npm run build:test    both builds the tests read, in one run: the local one into dist/ and
 *                         the CDN one into test-output/cdn-build/ (`--env testBuilds`)
 */
/* eslint-disable @typescript-eslint/no-require-imports -- a CommonJS file, loaded by webpack-cli */
const path = require("node:path");
const CopyWebpackPlugin = require("copy-webpack-plugin");
const HtmlWebpackPlugin = require("html-webpack-plugin");
const CustomFunctionsMetadataPlugin = require("custom-functions-metadata-plugin");
const { AllowErrorCellsPlugin } = require("./scripts/allow-error-cells-plugin.cjs");
const { HelpPagesPlugin } = require("./scripts/help-pages-plugin.cjs");
const { devCertificates } = require("./scripts/dev-certs.cjs");
const { contentPolicy, officeJsUrl } = require("./scripts/content-policy.cjs");

const PORT = 3000;

/** Files copied as they are, each named exactly (a wildcard at the root makes watch loop). */
function copyPatterns(useCdn) {
  const patterns = [
    { from: "manifest/manifest.xml", to: "manifest.xml" },
    { from: "manifest/icons", to: "assets" },
    { from: "taskpane/taskpane.css", to: "taskpane.css" },
  ];
  if (!useCdn) {
    patterns.push({
      // office.js loads its sibling files at run time, so the whole dist folder is copied.
      from: path.dirname(require.resolve("@microsoft/office-js/dist/office.js")),
      to: "office-js",
      info: { minimized: true },
    });
  }
  return patterns;
}

async function devServer() {
  const certificates = await devCertificates();
  const shared = {
    port: PORT,
    static: false,
    hot: false,
    liveReload: false,
    headers: { "Access-Control-Allow-Origin": "*" },
    client: false,
    onListening: () => printHowToLoad(certificates),
  };
  if (certificates.https === undefined) {
    return { ...shared, host: "127.0.0.1", server: "http" };
  }
  return {
    ...shared,
    host: "localhost",
    server: { type: "https", options: certificates.https },
  };
}

function printHowToLoad(certificates) {
  const lines = [""];
  if (certificates.https === undefined) {
    lines.push(
      `NOTICE: no https certificate (${certificates.problem}).`,
      `Serving plain http on http://127.0.0.1:${PORT}/ — enough to open taskpane.html in a browser,`,
      "but a spreadsheet host loads add-ins over https only. Fix the certificate and run npm start again.",
    );
  } else {
    lines.push(
      `Echolot is served at https://localhost:${PORT}/ (manifest: https://localhost:${PORT}/manifest.xml).`,
      certificates.reused
        ? `Reusing the development CA ${certificates.caPath}: still valid for ${certificates.daysLeft} days. If you trusted it before, nothing to do.`
        : `Made a new development CA, valid for ${certificates.daysLeft} days: ${certificates.caPath}`,
      "Trust it once on the machine that runs the spreadsheet host, for example:",
      "  Debian/Ubuntu: cp <ca.crt> /usr/local/share/ca-certificates/office-addin-dev-ca.crt && update-ca-certificates",
      "  macOS:         security add-trusted-cert -d -r trustRoot -k ~/Library/Keychains/login.keychain-db <ca.crt>",
      "  Windows:       certutil -user -addstore Root <ca.crt>",
    );
  }
  lines.push(
    "",
    "Load the add-in (sideload manifest/manifest.xml):",
    "  Desktop host: put manifest.xml in a folder shared as a trusted add-in catalog",
    "    (Trust Center > Trusted Add-in Catalogs), restart, then Insert > My Add-ins > Shared Folder.",
    "  Web host: open a workbook, Home > Add-ins > More add-ins > My add-ins > Upload My Add-in,",
    "    and choose manifest/manifest.xml.",
    "Then type =ECHOLOT.SERIESLAGTABLE(B2:B241) beside a column of residuals.",
    "",
  );
  console.log(lines.join("\n"));
}

/** "cdn" or "local": the --env switch, else OFFICE_JS, else the CDN for production only. */
function officeJsSource(env, production) {
  const chosen = env.officeJs ?? process.env.OFFICE_JS ?? (production ? "cdn" : "local");
  if (chosen !== "cdn" && chosen !== "local") {
    throw new Error(`officeJs must be "cdn" or "local" (got "${chosen}")`);
  }
  return chosen;
}

/** Where the CDN build the tests read is written (`--env testBuilds`). */
const CDN_TEST_BUILD = path.resolve(__dirname, "test-output", "cdn-build");

module.exports = async (env, argv) => {
  if (env?.testBuilds) {
    // One webpack run for both builds the tests read (test/setup/freshBuilds.ts checks them).
    const local = await configuration({ ...env, officeJs: "local" }, argv);
    const cdn = await configuration({ ...env, officeJs: "cdn" }, argv);
    return [
      { ...local, name: "local" },
      { ...cdn, name: "cdn", output: { ...cdn.output, path: CDN_TEST_BUILD } },
    ];
  }
  return configuration(env, argv);
};

async function configuration(env, argv) {
  const production = argv.mode === "production";
  const officeJs = officeJsSource(env ?? {}, production);
  const useCdn = officeJs === "cdn";
  const serving = Boolean(process.env.WEBPACK_SERVE);
  return {
    mode: production ? "production" : "development",
    devtool: production ? "source-map" : "eval-source-map",
    context: __dirname,
    entry: {
      functions: "./functions/functions.ts",
      taskpane: "./taskpane/taskpane.ts",
    },
    output: {
      path: path.resolve(__dirname, "dist"),
      filename: "[name].js",
      clean: true,
      // Write every file on every build, so a file's time says when it was built (the tests
      // refuse a bundle older than its sources).
      compareBeforeEmit: false,
    },
    resolve: { extensions: [".ts", ".js"] },
    module: {
      rules: [
        {
          test: /\.ts$/,
          exclude: /node_modules/,
          use: { loader: "ts-loader", options: { transpileOnly: true } },
        },
        // `import text from "./file.csv?raw"`: the pane's demo data, bundled as text.
        { resourceQuery: /raw/, type: "asset/source" },
      ],
    },
    plugins: [
      new CustomFunctionsMetadataPlugin({
        output: "functions.json",
        input: "./functions/functions.ts",
      }),
      new AllowErrorCellsPlugin({ file: "functions.json" }),
      new HelpPagesPlugin({ metadata: "functions.json", help: "functions/help.json" }),
      new HtmlWebpackPlugin({
        filename: "taskpane.html",
        template: "./taskpane/taskpane.html",
        chunks: ["functions", "taskpane"],
        chunksSortMode: "manual",
        officeJs: officeJsUrl(officeJs),
        contentPolicy: contentPolicy(officeJs),
      }),
      new CopyWebpackPlugin({ patterns: copyPatterns(useCdn) }),
    ],
    performance: { hints: false },
    // While serving, keep the console to the load instructions and real problems.
    stats: serving ? "errors-warnings" : "normal",
    watchOptions: { ignored: ["**/node_modules/**", "**/dist/**", "**/build/**", "**/.git/**"] },
    ...(serving ? { devServer: await devServer() } : {}),
  };
}

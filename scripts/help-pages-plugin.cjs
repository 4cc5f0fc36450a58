/**
 * Webpack step: one offline help page per cell function, served with the add-in under help/
 * (help/<id in lower case>.html, plus help/index.html), which each function's @helpurl names.
 * A page shows the function's description and arguments (from the functions.json the metadata
 * plugin generates from the JSDoc), an example and its result, and the refusals a user can meet,
 * with their error and message (functions/help.json; test/functions/help.test.ts checks each
 * message against the built function). List this plugin after the metadata plugin.
 */
/* eslint-disable @typescript-eslint/no-require-imports -- a CommonJS file, loaded by webpack-cli */
const fs = require("node:fs");
const path = require("node:path");
const { Compilation, sources } = require("webpack");

const PLUGIN_NAME = "HelpPagesPlugin";

const POLICY =
  "default-src 'none'; style-src 'self'; img-src 'self' data:; base-uri 'none'; form-action 'none'";

const CSS = `body { font: 15px/1.5 system-ui, sans-serif; color: #1d232a; margin: 0; }
main { max-width: 46rem; margin: 0 auto; padding: 1rem 1.25rem 3rem; }
h1 { font-size: 1.4rem; margin-bottom: 0.25rem; }
h2 { font-size: 1.05rem; margin-top: 1.6rem; border-bottom: 1px solid #e8e4dc; }
table { border-collapse: collapse; width: 100%; }
th, td { text-align: left; vertical-align: top; padding: 0.3rem 0.5rem; border-bottom: 1px solid #f4f1ea; }
code, pre { font-family: ui-monospace, monospace; background: #f4f1ea; }
pre { padding: 0.5rem 0.75rem; overflow-x: auto; }
.note { color: #56636f; }
`;

function escape(text) {
  return String(text).replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function page(title, body) {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${POLICY}">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escape(title)}</title>
<link rel="stylesheet" href="help.css">
</head>
<body><main>
${body}
</main></body>
</html>
`;
}

function functionPage(fn, help, inputs) {
  const args = fn.parameters
    .map(
      (p) =>
        `<tr><td><code>${escape(p.name)}</code></td><td>${p.optional ? "optional" : "required"}</td><td>${escape(p.description ?? "")}</td></tr>`,
    )
    .join("\n");
  const signature = fn.parameters.map((p) => (p.optional ? `[${p.name}]` : p.name)).join(", ");
  const refusals = help.refusals
    .map(
      (r) =>
        `<tr><td>${escape(r.when)}<br><span class="note">${escape(r.args.map((a) => inputs[a] ?? JSON.stringify(a)).join("; "))}</span></td><td><code>${escape(r.code)}</code></td><td>${escape(r.message)}</td></tr>`,
    )
    .join("\n");
  return page(
    `ECHOLOT.${fn.id}`,
    `<h1>ECHOLOT.${escape(fn.id)}(${escape(signature)})</h1>
<p>${escape(fn.description)}</p>
<h2>Arguments</h2>
<table><thead><tr><th>argument</th><th></th><th>what to give</th></tr></thead><tbody>
${args}
</tbody></table>
<p class="note">Leave trailing optional arguments out for their defaults. Blank cells and #N/A are
gaps, never zeros; a text first cell is the series' label.</p>
<h2>Example</h2>
<pre><code>${escape(help.example)}</code></pre>
<p>Spills ${escape(help.result)}.</p>
<h2>Refusals</h2>
<p>When the function cannot answer it shows #VALUE! (something to change) or #N/A (not enough
data) with a message; hover over the cell's error indicator, or select the cell with the Echolot
pane open, to read it.</p>
<table><thead><tr><th>when</th><th>error</th><th>message</th></tr></thead><tbody>
${refusals}
</tbody></table>
<p class="note">A verdict is a statistical screen, not a decision. <a href="index.html">All functions</a></p>`,
  );
}

function indexPage(functions) {
  const rows = functions
    .map(
      (fn) =>
        `<tr><td><a href="${fn.id.toLowerCase()}.html"><code>ECHOLOT.${escape(fn.id)}</code></a></td><td>${escape(fn.description)}</td></tr>`,
    )
    .join("\n");
  return page(
    "Echolot functions",
    `<h1>Echolot cell functions</h1>\n<table><tbody>\n${rows}\n</tbody></table>`,
  );
}

class HelpPagesPlugin {
  /** @param {{ metadata?: string, help: string }} options */
  constructor(options) {
    this.metadata = options.metadata ?? "functions.json";
    this.help = options.help;
  }

  /** @param {import("webpack").Compiler} compiler */
  apply(compiler) {
    compiler.hooks.thisCompilation.tap(PLUGIN_NAME, (compilation) => {
      compilation.fileDependencies.add(path.resolve(this.help));
      compilation.hooks.processAssets.tap(
        { name: PLUGIN_NAME, stage: Compilation.PROCESS_ASSETS_STAGE_ADDITIONAL },
        () => this.emit(compilation),
      );
    });
  }

  /** @param {import("webpack").Compilation} compilation */
  emit(compilation) {
    const asset = compilation.getAsset(this.metadata);
    if (asset === undefined) return; // the metadata plugin reports its own errors
    const { functions } = JSON.parse(asset.source.source().toString());
    const help = JSON.parse(fs.readFileSync(this.help, "utf8"));
    const add = (name, text) => compilation.emitAsset(`help/${name}`, new sources.RawSource(text));
    add("help.css", CSS);
    add("index.html", indexPage(functions));
    for (const fn of functions) {
      const entry = help.functions[fn.id];
      if (entry === undefined) {
        compilation.errors.push(new Error(`${PLUGIN_NAME}: ${this.help} has no help for ${fn.id}`));
        continue;
      }
      add(`${fn.id.toLowerCase()}.html`, functionPage(fn, entry, help.arguments));
    }
  }
}

module.exports = { HelpPagesPlugin };

/**
 * The offline help pages (dist/help/, from scripts/help-pages-plugin.cjs): each function's
 * @helpurl names a page served with the add-in, the page shows the function's arguments, an
 * example and its refusals, and every refusal's message is the one the built function gives for
 * the input the page describes.
 */
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { seriesFColumn } from "../pane/seriesF";
import { columnRange, DIST, distFile, loadBuiltFunctions, type LoadedAddIn } from "./host";

interface Help {
  readonly arguments: Readonly<Record<string, string>>;
  readonly functions: Readonly<
    Record<
      string,
      {
        readonly example: string;
        readonly refusals: readonly {
          readonly args: readonly unknown[];
          readonly code: string;
          readonly message: string;
        }[];
      }
    >
  >;
}

const help = JSON.parse(readFileSync(join(DIST, "..", "functions", "help.json"), "utf8")) as Help;

/** The inputs the help pages name, as the host would pass them. */
function input(arg: unknown): unknown {
  const f = seriesFColumn();
  const inputs: Record<string, () => unknown> = {
    "@F": () => columnRange(f),
    "@text": () => columnRange(f.map((v, i) => (i === 5 ? "n/a" : v))),
    "@short": () => columnRange(["errors", 1.5, -0.5]),
    "@block": () =>
      f.map((v, i) => [v, i === 0 ? "other" : Number(v) % 7, i === 0 ? "third" : Number(v) % 5]),
    "@blockText": () => f.map((v, i) => [v, i === 0 ? "other" : i === 4 ? "n/a" : Number(v) % 7]),
  };
  return typeof arg === "string" && inputs[arg] !== undefined ? inputs[arg]() : arg;
}

/** A page's text as a reader sees it: tags removed, character references decoded. */
function textOf(html: string): string {
  const named: Record<string, string> = { amp: "&", lt: "<", gt: ">", quot: '"', apos: "'" };
  return html
    .replace(/<[^>]*>/g, " ")
    .replace(/&(#\d+|[a-z]+);/g, (whole, ref: string) =>
      ref.startsWith("#") ? String.fromCharCode(Number(ref.slice(1))) : (named[ref] ?? whole),
    )
    .replace(/\s+/g, " ");
}

describe("the functions' offline help pages", () => {
  let addIn: LoadedAddIn;
  beforeAll(() => {
    addIn = loadBuiltFunctions();
  });

  it("every function's help link names its page, served with the add-in from localhost", () => {
    for (const fn of addIn.metadata.functions) {
      const url = (fn as { helpUrl?: string }).helpUrl;
      expect(url, fn.id).toBe(`https://localhost:3000/help/${fn.id.toLowerCase()}.html`);
      expect(() => distFile(`help/${fn.id.toLowerCase()}.html`)).not.toThrow();
    }
  });

  it("each page shows the arguments, an example and the refusals, with no outside address", () => {
    for (const fn of addIn.metadata.functions) {
      const html = readFileSync(distFile(`help/${fn.id.toLowerCase()}.html`), "utf8");
      const text = textOf(html);
      for (const p of fn.parameters) {
        expect(html, `${fn.id} ${p.name}`).toContain(`<code>${p.name}</code>`);
        expect(text).toContain(p.description ?? "?");
      }
      const entry = help.functions[fn.id];
      expect(entry, fn.id).toBeDefined();
      expect(text).toContain(entry?.example ?? "?");
      for (const refusal of entry?.refusals ?? []) expect(text).toContain(refusal.message);
      expect(html.match(/https?:\/\//g) ?? []).toEqual([]);
    }
  });

  it("each refusal a page lists is what the built function gives for that input", () => {
    for (const [id, entry] of Object.entries(help.functions)) {
      for (const refusal of entry.refusals) {
        const result = addIn.invoke(id, ...refusal.args.map(input));
        expect(result, `${id}(${JSON.stringify(refusal.args)})`).toEqual({
          error: expect.objectContaining({ code: refusal.code, message: refusal.message }),
        });
      }
    }
  });
});

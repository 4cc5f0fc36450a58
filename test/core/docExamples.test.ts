/**
 * Every `@example` in a doc comment of src/core/*.ts is run against the core and checked, so an
 * example cannot drift from what the code does. An example is plain JavaScript with every export
 * of src/core in scope. A line ending in `// → value` must give exactly that value (deep
 * equality; a typed array compares as the plain array of its elements); a line ending in
 * `// ≈ value` must give it to a relative 1e-12 (for a result that is not a short decimal).
 * Other lines run as written. An example with no checked line fails.
 */
import { readdirSync, readFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import * as core from "../../src/core";

const CORE = resolve(__dirname, "..", "..", "src", "core");

interface Example {
  readonly file: string;
  /** 1-based line of the `@example` tag. */
  readonly line: number;
  readonly code: readonly string[];
}

/** The `@example` blocks of one source file: lines after the tag, to the next tag or the end. */
function examplesIn(file: string): Example[] {
  const lines = readFileSync(join(CORE, file), "utf8").split("\n");
  const examples: Example[] = [];
  let current: { line: number; code: string[] } | undefined;
  const close = () => {
    if (current !== undefined) examples.push({ file, ...current });
    current = undefined;
  };
  lines.forEach((text, index) => {
    const inComment = /^\s*\*(\s|$)/.test(text) && !/^\s*\*\//.test(text);
    const body = text.replace(/^\s*\*\s?/, "");
    if (!inComment) return close();
    if (/^@example\b/.test(body)) {
      close();
      current = { line: index + 1, code: [] };
    } else if (/^@\w/.test(body)) {
      close();
    } else if (current !== undefined && !/^```/.test(body) && body.trim() !== "") {
      current.code.push(body);
    }
  });
  close();
  return examples;
}

/** A typed array as the plain array of its elements; anything else as it is. */
function plain(value: unknown): unknown {
  return ArrayBuffer.isView(value) && !(value instanceof DataView)
    ? Array.from(value as unknown as ArrayLike<number>)
    : value;
}

interface Check {
  readonly source: string;
  readonly kind: "→" | "≈";
  readonly actual: unknown;
  readonly expected: unknown;
}

/** Runs an example with the core's exports in scope and returns its checked lines. */
function run(example: Example): Check[] {
  const statements: string[] = [];
  example.code.forEach((line, i) => {
    const marked = /^(.*?);?\s*\/\/\s*(→|≈)\s*(.+)$/.exec(line);
    if (marked === null) {
      statements.push(line);
      return;
    }
    const [, expression, kind, expected] = marked as unknown as [string, string, string, string];
    statements.push(
      `checks.push({ source: ${JSON.stringify(line)}, kind: "${kind}",` +
        ` actual: (${expression}), expected: (${expected}) }); // example line ${i + 1}`,
    );
  });
  const names = Object.keys(core);
  const body = `"use strict";\nconst checks = [];\n${statements.join("\n")}\nreturn checks;`;
  const values = names.map((name) => (core as Record<string, unknown>)[name]);
  return new Function(...names, body)(...values) as Check[];
}

function expectCheck(check: Check, where: string): void {
  const actual = plain(check.actual);
  const expected = plain(check.expected);
  const what = `${where}: ${check.source} gave ${JSON.stringify(actual)}`;
  if (check.kind === "→") {
    expect(actual, what).toEqual(expected);
    return;
  }
  const actuals = Array.isArray(actual) ? actual : [actual];
  const expecteds = Array.isArray(expected) ? expected : [expected];
  expect(actuals.length, what).toBe(expecteds.length);
  actuals.forEach((a, i) => {
    const e = expecteds[i] as number;
    expect(Math.abs((a as number) - e) <= 1e-12 * Math.abs(e), `${what} (element ${i})`).toBe(true);
  });
}

const files = readdirSync(CORE)
  .filter((name) => name.endsWith(".ts"))
  .sort();
const examples = files.flatMap(examplesIn);

describe("the @example of each core doc comment gives what it shows", () => {
  it("finds examples in src/core (the documented entry points)", () => {
    expect(examples.length).toBeGreaterThanOrEqual(8);
  });

  it("runs every @example tag written in src/core, so none is skipped by the parser", () => {
    // A plain count of the tag in the sources, independent of the doc-comment parser above.
    const tags = files.flatMap((file) =>
      readFileSync(join(CORE, file), "utf8")
        .split("\n")
        .flatMap((text, index) => (/@example\b/.test(text) ? [`${file}:${index + 1}`] : [])),
    );
    expect(examples.map((example) => `${example.file}:${example.line}`)).toEqual(tags);
  });

  for (const example of examples) {
    const where = `src/core/${example.file}:${example.line}`;
    it(`${where} runs and gives what it shows`, () => {
      const checks = run(example);
      expect(checks.length, `${where} checks nothing`).toBeGreaterThan(0);
      for (const check of checks) expectCheck(check, where);
    });
  }
});

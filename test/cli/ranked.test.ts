/**
 * The CLI for many items, through the built CLI on the planner's invented file of 150 items × 104
 * weeks (plannerItems.ts, from the project's seeded generator): batch and audit in the core's one
 * ranked order (kept findings first, then watch, clear, short; within each by q-value, ties by p,
 * then input order), within 80 columns with the findings behind --reasons, --top, --kept and
 * --csv. The CSV is read back with csv-parse, a general-purpose RFC 4180 reader from the registry.
 */
import { readFileSync } from "node:fs";
import { parse } from "csv-parse/sync";
import { beforeAll, describe, expect, it } from "vitest";
import type {
  AuditDocumentJson,
  AuditEntryJson,
  BatchDocumentJson,
  BatchEntryJson,
  NotAuditedEntryJson,
} from "../../src/cli/jsonBatch";
import { plannerFile } from "./plannerItems";
import { csvFile, runCli } from "./run";

/** An entry of either ranked document, as the ranking reads it. */
type Entry = BatchEntryJson | AuditEntryJson | NotAuditedEntryJson;

const ALPHA = 0.05;
/** Each CLI run analyses 150 series; a test makes up to three, on a loaded 2-core machine. */
const SLOW = { timeout: 240_000 };
let file = "";

function run(args: readonly string[]): string {
  const result = runCli(args);
  expect(result.stderr, `stderr of echolot ${args.join(" ")}`).toBe("");
  expect(result.status, `status of echolot ${args.join(" ")}`).toBe(0);
  return result.stdout;
}

const json = <T>(args: readonly string[]) => JSON.parse(run([...args, "--json"])) as T;

/** The labels of a text table's rows, in the order printed: lines that start with a rank. */
function tableLabels(text: string): string[] {
  return text.split("\n").flatMap((line) => /^\s*\d+ (item \d{3})\s+\d+\s/.exec(line)?.[1] ?? []);
}

/** Width in characters (code points), not bytes: "≤" and "─" count one each. */
const width = (line: string) => Array.from(line).length;

/** A finding kept by a false-discovery step: lag structure or bias. */
const keptFinding = (e: Entry) => e.kept || e.biased;

/**
 * The documented ranking (README, "Ranked tables"): group (kept finding, watch, clear, short, not
 * analysed), then q — in the kept group the smaller kept q-value — then p, then input position.
 */
function rankKey(e: Entry, biasQ: number): number[] {
  const groups: Record<string, number> = { structure: 0, watch: 1, clear: 2, short: 3 };
  const group = keptFinding(e) ? 0 : e.word === null ? 4 : (groups[e.word] as number);
  const keptQ = Math.min(e.kept ? (e.qValue as number) : Infinity, e.biased ? biasQ : Infinity);
  return [group, group === 0 ? keptQ : (e.qValue ?? Infinity), e.p ?? Infinity, e.position];
}

function expectRankedOrder<E extends Entry>(entries: readonly E[], biasQ: (e: E) => number): void {
  entries.forEach((entry, i) => expect(entry.rank, `rank of entry ${i}`).toBe(i + 1));
  for (let i = 1; i < entries.length; i++) {
    const a = rankKey(entries[i - 1] as E, biasQ(entries[i - 1] as E));
    const b = rankKey(entries[i] as E, biasQ(entries[i] as E));
    const first = a.findIndex((x, k) => x !== b[k]);
    const inOrder = first >= 0 && (a[first] as number) < (b[first] as number);
    expect(inOrder, `${a.join(" ")} before ${b.join(" ")}`).toBe(true);
  }
}

// A q-value is null in the JSON where the core's is NaN (not analysed).
const batchBiasQ = (e: BatchEntryJson) => e.biasQValue ?? Infinity;
const auditBiasQ = (e: AuditEntryJson | NotAuditedEntryJson) =>
  ("bias" in e ? e.bias.qValue : null) ?? Infinity;

beforeAll(() => {
  file = csvFile("planner-150.csv", plannerFile().csv);
});

describe("echolot batch at 150 items", SLOW, () => {
  let doc: BatchDocumentJson;
  let text: string;
  beforeAll(() => {
    doc = json(["batch", file]);
    text = run(["batch", file]);
  });

  it("batch --json lists all 150 series in ranked order: kept findings first, ties in q by p, then file order", () => {
    expect(doc.version).toBe(2);
    expect(doc.total).toBe(150);
    expect(doc.series).toHaveLength(150);
    expectRankedOrder(doc.series, batchBiasQ);
    // The data hold ties in q (Benjamini–Hochberg q-values are step-ups): the rule must settle them.
    const qs = doc.series.map((e) => e.qValue);
    expect(new Set(qs).size).toBeLessThan(qs.length);
    expect(new Set(doc.series.map((e) => e.position)).size).toBe(150);
  });

  it("batch prints its rows in the JSON's ranked order, the kept findings above a cut line", () => {
    expect(tableLabels(text)).toEqual(doc.series.map((e) => e.label));
    expect(doc.series.filter((e) => e.kept).length).toBe(doc.flaggedFdr);
    const kept = doc.series.filter(keptFinding).length;
    expect(kept).toBeGreaterThan(0);
    const lines = text.split("\n");
    const cut = lines.findIndex((l) => l.includes("above: kept after the false-discovery step"));
    expect(cut).toBeGreaterThan(0);
    expect(tableLabels(lines.slice(0, cut).join("\n"))).toHaveLength(kept);
  });

  it("batch text stays within 80 columns: lag-structure p and q-value, bias q-value, headline", () => {
    for (const line of text.split("\n")) expect(width(line), line).toBeLessThanOrEqual(80);
    expect(text).toMatch(/^\s+─ lag structure ─ ─ bias ─$/m);
    expect(text).toMatch(/^\s+# series\s+n\s+p\s+q-value\s+q-value\s+headline$/m);
    const biased = doc.series.find((e) => e.biased) as BatchEntryJson;
    expect(text).toMatch(new RegExp(`^\\s+\\d+ ${biased.label} .* ${biased.word}, biased$`, "m"));
  });

  it("batch --top 12 shows the first 12 ranked rows, in text, JSON and CSV", () => {
    const first = doc.series.slice(0, 12).map((e) => e.label);
    const top = run(["batch", file, "--top", "12"]);
    expect(tableLabels(top)).toEqual(first);
    expect(top).toMatch(/showing the first 12 of 150 ranked rows/);
    const topDoc = json<BatchDocumentJson>(["batch", file, "--top", "12"]);
    expect(topDoc.series.map((e) => e.label)).toEqual(first);
    expect(topDoc.total).toBe(150);
    const csv = parse(run(["batch", file, "--top", "12", "--csv"]), { columns: true }) as Record<
      string,
      string
    >[];
    expect(csv.map((r) => r.label)).toEqual(first);
  });

  it("batch --kept shows only the rows with a finding kept after the false-discovery step", () => {
    const kept = doc.series.filter(keptFinding).map((e) => e.label);
    expect(tableLabels(run(["batch", file, "--kept"]))).toEqual(kept);
    const keptDoc = json<BatchDocumentJson>(["batch", file, "--kept"]);
    expect(keptDoc.series.map((e) => e.label)).toEqual(kept);
    for (const e of keptDoc.series) {
      const structure = e.kept && (e.qValue as number) <= ALPHA;
      const bias = e.biased && (e.biasQValue as number) <= ALPHA;
      expect(structure || bias, e.label).toBe(true);
    }
    expect(tableLabels(run(["batch", file, "--kept", "--top", "3"]))).toEqual(kept.slice(0, 3));
  });

  it("batch --csv writes the ranked table as RFC 4180 CSV that a CSV reader gives back whole", () => {
    const csv = run(["batch", file, "--csv"]);
    // RFC 4180 section 2: records end in CRLF; the header holds the documents' field names.
    expect(csv.endsWith("\r\n")).toBe(true);
    expect(csv.split("\r\n")[0]).toBe(
      "rank,label,position,n,statistic,df,p,pReference,qValue,kept,mean,biasP,biasQValue,biased,reading,word,title,finding",
    );
    const rows = parse(csv, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(150);
    rows.forEach((row, i) => {
      const entry = doc.series[i] as BatchEntryJson;
      expect(row.rank).toBe(String(i + 1));
      expect(row.label).toBe(entry.label);
      expect(Number(row.qValue)).toBe(entry.qValue);
      expect(Number(row.statistic)).toBe(entry.statistic);
      expect(row.kept).toBe(String(entry.kept));
      expect(row.biased).toBe(String(entry.biased));
      expect(row.title).toBe(entry.title);
      // Findings hold commas and quotes: quoted, they come back whole.
      expect(row.finding).toBe(entry.finding);
    });
  });

  it("batch --csv --out writes the file, says so, and never writes over it without --force", () => {
    const out = `${file}.ranked.csv`;
    const kept = doc.series.filter(keptFinding).map((e) => e.label);
    const said = run(["batch", file, "--csv", "--kept", "--out", out]);
    expect(said).toMatch(new RegExp(`wrote .*ranked\\.csv: ${kept.length} of 150 rows`));
    const rows = parse(readFileSync(out, "utf8"), { columns: true }) as Record<string, string>[];
    expect(rows.map((r) => r.label)).toEqual(kept);
    const again = runCli(["batch", file, "--csv", "--out", out]);
    expect(again.status).toBe(2);
    expect(again.stderr).toMatch(/already exists: give --force/);
  });
});

describe("echolot audit at 150 items", SLOW, () => {
  let doc: AuditDocumentJson;
  let text: string;
  beforeAll(() => {
    doc = json(["audit", file, "--horizon", "1"]);
    text = run(["audit", file, "--horizon", "1"]);
  });

  it("audit --json ranks like batch: kept findings first, ties in q by p, then file order", () => {
    expect(doc.version).toBe(2);
    expect(doc.series).toHaveLength(150);
    expectRankedOrder(doc.series, auditBiasQ);
    for (const entry of doc.series) {
      expect(entry.biased, entry.label).toBe(auditBiasQ(entry) <= ALPHA);
    }
  });

  it("audit prints its rows in the JSON's ranked order within 80 columns, without the findings", () => {
    expect(tableLabels(text)).toEqual(doc.series.map((e) => e.label));
    for (const line of text.split("\n")) expect(width(line), line).toBeLessThanOrEqual(80);
    const first = doc.series[0] as Entry;
    expect(text.replace(/\s+/g, " ")).not.toContain(first.finding as string);
    expect(text).toMatch(/The reasons of \d+ shown rows: add --reasons\./);
  });

  it("audit --reasons adds each shown row's headline and finding, still within 80 columns", () => {
    const reasons = run(["audit", file, "--horizon", "1", "--reasons", "--top", "20"]);
    for (const line of reasons.split("\n")) expect(width(line), line).toBeLessThanOrEqual(80);
    const first = doc.series[0] as Entry;
    expect(reasons).toMatch(new RegExp(`^\\s+1 ${first.label}: \\S ${first.title}$`, "m"));
    expect(reasons.replace(/\s+/g, " ")).toContain(first.finding as string);
  });

  it("audit --top, --kept and --csv select and write as batch does", () => {
    const kept = doc.series.filter(keptFinding).map((e) => e.label);
    expect(tableLabels(run(["audit", file, "--horizon", "1", "--kept"]))).toEqual(kept);
    expect(tableLabels(run(["audit", file, "--horizon", "1", "--top", "7"]))).toEqual(
      doc.series.slice(0, 7).map((e) => e.label),
    );
    const rows = parse(run(["audit", file, "--horizon", "1", "--csv", "--kept"]), {
      columns: true,
    }) as Record<string, string>[];
    expect(rows.map((r) => r.label)).toEqual(kept);
    expect(Object.keys(rows[0] ?? {})).toEqual(
      expect.arrayContaining(["rank", "biasMean", "biasQValue", "biased", "statistic", "kept"]),
    );
  });
});

/**
 * The CLI for many items, through the built CLI on a planner's invented file of 150 items × 104
 * weeks (plannerItems.ts): batch and audit in one ranked order (q-value, ties by p, then input
 * order), audit within 80 columns with its reasons behind --reasons, --top, --kept and --csv.
 * The CSV is read back with csv-parse, a general-purpose RFC 4180 reader from the registry.
 */
import { readFileSync } from "node:fs";
import { parse } from "csv-parse/sync";
import { beforeAll, describe, expect, it } from "vitest";
import { plannerFile } from "./plannerItems";
import { csvFile, runCli } from "./run";

interface Entry {
  readonly rank: number;
  readonly label: string;
  readonly position: number;
  readonly p: number | null;
  readonly qValue: number | null;
  readonly kept: boolean;
  readonly bias?: { readonly p: number; readonly qValue: number };
}

interface Document {
  readonly version: number;
  readonly total: number;
  readonly alpha: number;
  readonly series: readonly Entry[];
  readonly flaggedFdr: number;
}

const ALPHA = 0.05;
let file = "";

function run(args: readonly string[]): string {
  const result = runCli(args);
  expect(result.stderr, `stderr of echolot ${args.join(" ")}`).toBe("");
  expect(result.status, `status of echolot ${args.join(" ")}`).toBe(0);
  return result.stdout;
}

const json = (args: readonly string[]) => JSON.parse(run([...args, "--json"])) as Document;

/** The labels of a text table's rows, in the order printed: lines that start with a rank. */
function tableLabels(text: string): string[] {
  return text.split("\n").flatMap((line) => /^\s*\d+ (item-\d{3})\s+\d+\s/.exec(line)?.[1] ?? []);
}

/** Width in characters (code points), not bytes: "≤" and "─" count one each. */
const width = (line: string) => Array.from(line).length;

/** Whether `entries` follow the ranking rule: key q, then key p, then input position. */
function expectRankedOrder(entries: readonly Entry[], key: (e: Entry) => [number, number]): void {
  entries.forEach((entry, i) => expect(entry.rank, `rank of entry ${i}`).toBe(i + 1));
  for (let i = 1; i < entries.length; i++) {
    const a = entries[i - 1] as Entry;
    const b = entries[i] as Entry;
    const [qa, pa] = key(a);
    const [qb, pb] = key(b);
    const inOrder = qa < qb || (qa === qb && (pa < pb || (pa === pb && a.position < b.position)));
    expect(inOrder, `${a.label} (q ${qa}, p ${pa}) before ${b.label} (q ${qb}, p ${pb})`).toBe(
      true,
    );
  }
}

const batchKey = (e: Entry): [number, number] => [e.qValue ?? Infinity, e.p ?? Infinity];
const auditKey = (e: Entry): [number, number] => [
  Math.min(e.qValue ?? Infinity, e.bias?.qValue ?? Infinity),
  Math.min(e.p ?? Infinity, e.bias?.p ?? Infinity),
];

beforeAll(() => {
  file = csvFile("planner-150.csv", plannerFile().csv);
});

describe("echolot batch at 150 items", () => {
  let doc: Document;
  let text: string;
  beforeAll(() => {
    doc = json(["batch", file]);
    text = run(["batch", file]);
  });

  it("batch --json lists all 150 series in ranked order: q-value, ties by p, then file order", () => {
    expect(doc.version).toBe(2);
    expect(doc.total).toBe(150);
    expect(doc.series).toHaveLength(150);
    expectRankedOrder(doc.series, batchKey);
    // The data hold ties in q (Benjamini–Hochberg q-values are step-ups): the rule must settle them.
    const qs = doc.series.map((e) => e.qValue);
    expect(new Set(qs).size).toBeLessThan(qs.length);
    expect(new Set(doc.series.map((e) => e.position)).size).toBe(150);
  });

  it("batch prints its rows in the JSON's ranked order, the kept ones above a cut line", () => {
    const labels = tableLabels(text);
    expect(labels).toEqual(doc.series.map((e) => e.label));
    const kept = doc.series.filter((e) => e.kept).length;
    expect(kept).toBe(doc.flaggedFdr);
    expect(kept).toBe(doc.series.filter((e) => (e.qValue ?? 1) <= ALPHA).length);
    const lines = text.split("\n");
    const cut = lines.findIndex((l) => l.includes("above: kept after the false-discovery step"));
    expect(cut).toBeGreaterThan(0);
    expect(tableLabels(lines.slice(0, cut).join("\n"))).toHaveLength(kept);
  });

  it("batch text stays within 80 columns and names the statistic apart from the q-value", () => {
    for (const line of text.split("\n")) expect(width(line), line).toBeLessThanOrEqual(80);
    expect(text).toMatch(/^\s+# series\s+n\s+statistic\s+df\s+p\s+q-value\s+verdict/m);
  });

  it("batch --top 12 shows the first 12 ranked rows, in text, JSON and CSV", () => {
    const first = doc.series.slice(0, 12).map((e) => e.label);
    const top = run(["batch", file, "--top", "12"]);
    expect(tableLabels(top)).toEqual(first);
    expect(top).toMatch(/showing the first 12 of 150 ranked rows/);
    const topDoc = json(["batch", file, "--top", "12"]);
    expect(topDoc.series.map((e) => e.label)).toEqual(first);
    expect(topDoc.total).toBe(150);
    const csv = parse(run(["batch", file, "--top", "12", "--csv"]), { columns: true }) as Record<
      string,
      string
    >[];
    expect(csv.map((r) => r.label)).toEqual(first);
  });

  it("batch --kept shows only the rows kept after the false-discovery step", () => {
    const kept = doc.series.filter((e) => e.kept).map((e) => e.label);
    expect(kept.length).toBeGreaterThan(0);
    expect(tableLabels(run(["batch", file, "--kept"]))).toEqual(kept);
    const keptDoc = json(["batch", file, "--kept"]);
    expect(keptDoc.series.map((e) => e.label)).toEqual(kept);
    expect(keptDoc.series.every((e) => (e.qValue ?? 1) <= ALPHA)).toBe(true);
    expect(tableLabels(run(["batch", file, "--kept", "--top", "3"]))).toEqual(kept.slice(0, 3));
  });

  it("batch --csv writes the ranked table as RFC 4180 CSV that a CSV reader gives back whole", () => {
    const csv = run(["batch", file, "--csv"]);
    // RFC 4180 section 2: records end in CRLF, the header's names as the documents' fields.
    expect(csv.endsWith("\r\n")).toBe(true);
    expect(csv.split("\r\n")[0]).toBe(
      "rank,label,position,n,statistic,df,p,pReference,qValue,kept,verdict,reason",
    );
    const rows = parse(csv, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(150);
    rows.forEach((row, i) => {
      const entry = doc.series[i] as Entry & { statistic: number; reason: string };
      expect(row.rank).toBe(String(i + 1));
      expect(row.label).toBe(entry.label);
      expect(Number(row.qValue)).toBe(entry.qValue);
      expect(Number(row.statistic)).toBe(entry.statistic);
      expect(row.kept).toBe(String(entry.kept));
      // Reasons hold commas: quoted, they come back whole.
      expect(row.reason).toBe(entry.reason);
    });
  });

  it("batch --csv --out writes the file, says so, and never writes over it without --force", () => {
    const out = `${file}.ranked.csv`;
    const said = run(["batch", file, "--csv", "--kept", "--out", out]);
    expect(said).toMatch(new RegExp(`wrote .*ranked\\.csv: ${doc.flaggedFdr} of 150 rows`));
    const rows = parse(readFileSync(out, "utf8"), { columns: true }) as Record<string, string>[];
    expect(rows.map((r) => r.label)).toEqual(doc.series.filter((e) => e.kept).map((e) => e.label));
    const again = runCli(["batch", file, "--csv", "--out", out]);
    expect(again.status).toBe(2);
    expect(again.stderr).toMatch(/already exists: give --force/);
  });
});

describe("echolot audit at 150 items", () => {
  let doc: Document;
  let text: string;
  beforeAll(() => {
    doc = json(["audit", file, "--horizon", "1"]);
    text = run(["audit", file, "--horizon", "1"]);
  });

  it("audit --json ranks like batch: the smaller q-value of bias and dependence, ties by p, then file order", () => {
    expect(doc.version).toBe(2);
    expect(doc.series).toHaveLength(150);
    expectRankedOrder(doc.series, auditKey);
    for (const entry of doc.series) {
      const q = Math.min(entry.qValue ?? Infinity, entry.bias?.qValue ?? Infinity);
      expect(entry.kept, entry.label).toBe(q <= ALPHA);
    }
  });

  it("audit prints its rows in the JSON's ranked order within 80 columns, without the reasons", () => {
    expect(tableLabels(text)).toEqual(doc.series.map((e) => e.label));
    for (const line of text.split("\n")) expect(width(line), line).toBeLessThanOrEqual(80);
    expect(text).not.toMatch(/lags tested at 5%/);
    expect(text).toMatch(/The reasons of \d+ shown rows: add --reasons\./);
  });

  it("audit --reasons adds each shown row's reason, still within 80 columns", () => {
    const reasons = run(["audit", file, "--horizon", "1", "--reasons", "--top", "20"]);
    for (const line of reasons.split("\n")) expect(width(line), line).toBeLessThanOrEqual(80);
    const first = doc.series[0] as Entry;
    expect(reasons).toMatch(new RegExp(`^\\s+1 ${first.label}: ■ structure$`, "m"));
    expect(reasons.replace(/\s+/g, " ")).toMatch(/lags tested at 5%/);
  });

  it("audit --top, --kept and --csv select and write as batch does", () => {
    const kept = doc.series.filter((e) => e.kept).map((e) => e.label);
    expect(tableLabels(run(["audit", file, "--horizon", "1", "--kept"]))).toEqual(kept);
    expect(tableLabels(run(["audit", file, "--horizon", "1", "--top", "7"]))).toEqual(
      doc.series.slice(0, 7).map((e) => e.label),
    );
    const rows = parse(run(["audit", file, "--horizon", "1", "--csv", "--kept"]), {
      columns: true,
    }) as Record<string, string>[];
    expect(rows.map((r) => r.label)).toEqual(kept);
    expect(Object.keys(rows[0] ?? {})).toEqual(
      expect.arrayContaining(["rank", "biasMean", "biasQValue", "statistic", "qValue", "kept"]),
    );
  });
});

/**
 * Files as people export them, through the built CLI: each case here was mishandled before the
 * table reader (an empty line dropped, the wrong column analysed without a word, locale files
 * refused, UTF-16 unread, loose options).
 */
import { spawnSync } from "node:child_process";
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { dirname } from "node:path";
import { describe, expect, it } from "vitest";
import { seededRandom } from "../../src/sim/random";
import { whiteNoise } from "../../src/sim/processes";
import type { CheckJson } from "../../src/cli/json";
import type { BatchDocumentJson } from "../../src/cli/jsonBatch";
import { CLI_PATH, csvFile, runCli, type CliResult } from "./run";

function ok(result: CliResult, what: string): string {
  expect(result.stderr, `stderr of ${what}`).toBe("");
  expect(result.status, `status of ${what}`).toBe(0);
  return result.stdout;
}

function checkJson(args: readonly string[], input?: string | Buffer): CheckJson {
  return JSON.parse(ok(runCli(["check", ...args, "--json"], input), args.join(" "))) as CheckJson;
}

/** One message on stderr, status 2, nothing on stdout. */
function refused(args: readonly string[], message: RegExp, input?: string): void {
  const result = runCli(args, input);
  expect(result.stdout, `stdout of ${args.join(" ")}`).toBe("");
  expect(result.status, `status of ${args.join(" ")}: ${result.stderr}`).toBe(2);
  expect(result.stderr.trim().split("\n"), "one line on stderr").toHaveLength(1);
  expect(result.stderr).toMatch(message);
}

const values = Array.from(whiteNoise(seededRandom(42), 48), (v) => Number(v.toFixed(4)));
const plain = csvFile("plain.csv", ["resid", ...values.map(String)].join("\n") + "\n");
const reference = checkJson([plain]);

describe("echolot check: files as people export them", () => {
  it("reads an empty line of a one-column file as a gap (x,1,2,,4,5,3: n 5, gaps 1, r1 0.4)", () => {
    // r1 by hand: deviations −2, −1, ·, 1, 2, 0 from the mean 3; pairs (−2,−1), (1,2), (2,0) give
    // 2 + 2 + 0 = 4 over Σd² = 10, so r1 = 0.4 (the gap leaves the pair (−1,·) and (·,1) out).
    const doc = checkJson([csvFile("gap.csv", "x\n1\n2\n\n4\n5\n3\n")]);
    expect([doc.n, doc.gaps]).toEqual([5, 1]);
    expect(Math.abs(doc.lags[0]!.corr - 0.4)).toBeLessThan(1e-15);
  });

  it("names the file's own line of a bad cell after empty lines", () => {
    refused(
      ["check", csvFile("late.csv", "x\n1\n\n\n2\noops\n3\n")],
      /line 6, column 1 \("x"\) of .*late\.csv holds "oops"/,
    );
  });

  it("reads semicolon files with decimal commas, tab files and flags the same as the plain file", () => {
    const rows = (sep: string, comma: boolean) =>
      ["date", "resid"].join(sep) +
      "\n" +
      values
        .map(
          (v, i) =>
            `2024-03-${String((i % 28) + 1).padStart(2, "0")}${sep}${comma ? String(v).replace(".", ",") : v}`,
        )
        .join("\n");
    const semicolon = checkJson([csvFile("semi.csv", rows(";", true))]);
    const tab = checkJson([csvFile("tab.tsv", rows("\t", false))]);
    const flagged = checkJson([
      csvFile("semi2.txt", rows(";", true)),
      "--delimiter",
      ";",
      "--decimal",
      ",",
    ]);
    for (const doc of [semicolon, tab, flagged]) {
      expect(doc.source).toMatch(
        /^column 2 \("resid"\) of .*; left out: column 1 \("date"\) holds dates/,
      );
      expect(doc.joint.q).toBe(reference.joint.q);
      expect(doc.lags.map((l) => l.corr)).toEqual(reference.lags.map((l) => l.corr));
    }
  });

  it("reads UTF-8 with a byte-order mark and UTF-16 (both byte orders) with one", () => {
    const text = readFileSync(plain, "utf8").replace(/\n/g, "\r\n");
    const utf16be = Buffer.from(`\ufeff${text}`, "utf16le").swap16();
    const files = [
      csvFile("bom8.csv", `\ufeff${text}`),
      csvFile("le16.csv", Buffer.from(`\ufeff${text}`, "utf16le")),
      csvFile("be16.csv", utf16be),
    ];
    for (const file of files) {
      const doc = checkJson([file]);
      expect(doc.label, file).toBe("resid");
      expect(doc.joint.q, file).toBe(reference.joint.q);
    }
    refused(
      ["check", csvFile("nobom16.csv", Buffer.from(text, "utf16le"))],
      /zero bytes, as UTF-16 text without a byte-order mark does/,
    );
  });

  it("reads standard input for -", () => {
    const doc = checkJson(["-"], readFileSync(plain, "utf8"));
    expect(doc.source).toBe('column 1 ("resid") of standard input');
    expect(doc.joint.q).toBe(reference.joint.q);
  });

  it("refuses gap words it was not given, and reads them as gaps with --na", () => {
    const file = csvFile("nan.csv", ["resid", "nan", ...values.map(String), "null"].join("\n"));
    refused(
      ["check", file],
      /line 2, column 1 \("resid"\) .* holds "nan", .*give --na nan to read it as a gap/,
    );
    const doc = checkJson([file, "--na", "nan,null"]);
    expect(doc.n).toBe(values.length);
    expect(doc.joint.q).toBe(reference.joint.q);
  });

  it("reads percent cells only with --percent", () => {
    const file = csvFile("pct.csv", ["ret", ...values.map((v) => `${v}%`)].join("\n"));
    refused(["check", file], /holds "-?[\d.]+%", .*give --percent/);
    const doc = checkJson([file, "--percent"]);
    expect(Math.abs(doc.lags[0]!.corr - reference.lags[0]!.corr)).toBeLessThan(1e-12);
  });

  it("refuses a first row of numbers with the --no-header hint, and reads every value with --no-header", () => {
    const file = csvFile("nohead.csv", values.join("\n"));
    refused(["check", file], /line 1 of .*nohead\.csv holds only numbers .*give --no-header/);
    const doc = checkJson([file, "--no-header"]);
    expect(doc.n).toBe(values.length);
    expect(doc.source).toMatch(/^column 1 of /);
  });
});

describe("echolot: nothing chosen silently", () => {
  const rows = values
    .slice(0, 30)
    .map((v, i) => [
      String(i + 1),
      String(20240101 + i),
      String(45292 + i),
      String(v),
      String(10 + v),
    ]);
  const header = "id,day,serial,resid,fitted";

  it("names the column analysed and every column passed over on the way", () => {
    const file = csvFile("ids.csv", [header, ...rows.map((r) => r.join(","))].join("\n"));
    const text = ok(runCli(["check", file]), "check ids.csv");
    expect(text.split("\n")[0]).toMatch(
      /^read: column 4 \("resid"\) of .*ids\.csv; left out: column 1 \("id"\) holds whole numbers that only rise or only fall \(1, 2, 3, …\): an id or time column; column 2 \("day"\) holds dates written as yyyymmdd .*; column 3 \("serial"\) holds whole numbers that read as spreadsheet dates/,
    );
  });

  it.each(["nan", "-", "#DIV/0!", "1.5%", "$1.50", '"1,234.5"'])(
    "refuses a residual column starting with %s at that cell instead of analysing the next column",
    (bad) => {
      const lines = rows.map((r, i) => (i === 0 ? [r[0], r[1], r[2], bad, r[4]] : r).join(","));
      refused(
        ["check", csvFile("bad-first.csv", [header, ...lines].join("\n"))],
        /^echolot: line 2, column 4 \("resid"\) of .*bad-first\.csv holds/,
      );
    },
  );

  it("batch lists every column it did not analyse, and why", () => {
    const lines = rows.map((r, i) => [...r, i === 3 ? "n/a?" : String(-r[4]!)].join(","));
    const file = csvFile("batch5.csv", [`${header},bad`, ...lines].join("\n"));
    const doc = JSON.parse(
      ok(runCli(["batch", file, "--json"]), "batch --json"),
    ) as BatchDocumentJson;
    // The series come in the core's ranked order: compare them as a set.
    expect(doc.series.map((s) => s.label).sort()).toEqual(["fitted", "resid"]);
    expect(doc.notAnalysed.map((n) => n.name)).toEqual([
      'column 1 ("id")',
      'column 2 ("day")',
      'column 3 ("serial")',
      'column 6 ("bad")',
    ]);
    expect(doc.notAnalysed[3]!.reason).toMatch(/line 5, column 6 \("bad"\) .* holds "n\/a\?"/);
    const text = ok(runCli(["batch", file]), "batch");
    expect(text.split("\n").filter((l) => l.startsWith("not analysed: column"))).toHaveLength(4);
  });
});

describe("echolot: strict options", () => {
  it.each([
    { command: "check", rest: ["--out", "x.html"], refusedOption: "--out" },
    { command: "check", rest: ["--horizon", "2"], refusedOption: "--horizon" },
    { command: "batch", rest: ["--column", "resid"], refusedOption: "--column" },
    { command: "audit", rest: ["--horizon", "1", "--bands", "robust"], refusedOption: "--bands" },
    { command: "report", rest: ["--out", "r.html", "--json"], refusedOption: "--json" },
  ])(
    "$command refuses $refusedOption, an option it does not use",
    ({ command, rest, refusedOption }) => {
      refused(
        [command, plain, ...rest],
        new RegExp(`unknown option ${refusedOption} for ${command}; ${command} takes: --`),
      );
    },
  );

  it("refuses a repeated option and numbers not written in decimal", () => {
    refused(["check", plain, "--lags", "3", "--lags", "4"], /--lags is given twice/);
    for (const bad of ["0x10", "1e", "12abc", "Infinity"]) {
      refused(
        ["check", plain, "--lags", bad],
        new RegExp(`--lags must be a number written in decimal \\(got "${bad}"\\)`),
      );
    }
  });

  it.each(["check", "audit", "batch", "report", "fdr", "demo"])(
    "%s --help prints its usage",
    (command) => {
      const text = ok(runCli([command, "--help"]), `${command} --help`);
      expect(text).toMatch(new RegExp(`^usage: echolot ${command}\\b`));
    },
  );
});

describe("echolot: output that never destroys data", () => {
  it("report --out refuses an existing file without --force, and the input file always", () => {
    const out = csvFile("existing.html", "keep me");
    refused(["report", plain, "--out", out], /already exists: give --force/);
    expect(readFileSync(out, "utf8")).toBe("keep me");
    ok(runCli(["report", plain, "--out", out, "--force"]), "report --force");
    expect(readFileSync(out, "utf8")).toMatch(/^<!DOCTYPE html>/i);
    const before = readFileSync(plain, "utf8");
    refused(["report", plain, "--out", plain, "--force"], /is the input file/);
    expect(readFileSync(plain, "utf8")).toBe(before);
  });

  it("a failed write is one line, status 2, and leaves no partial file", () => {
    const missing = `${dirname(plain)}/no-such-folder/r.html`;
    refused(
      ["report", plain, "--out", missing],
      /cannot write .*r\.html: its folder does not exist/,
    );
    expect(readdirSync(dirname(plain)).filter((f) => f.endsWith(".partial"))).toEqual([]);
  });

  it("a full disk on standard output is one line and status 2", () => {
    if (!existsSync("/dev/full")) return;
    const result = runCliToShell(`check ${plain} > /dev/full`);
    expect(result.status).toBe(2);
    expect(result.stderr.trim().split("\n")).toEqual([
      "echolot: cannot write standard output: no space left on the device",
    ]);
  });

  it("a reader that closes the pipe early ends the run quietly with status 0", () => {
    // 300 columns of jsonl: well beyond a pipe's 64 KiB buffer, so the writer meets the closed pipe.
    const wide = Array.from({ length: 300 }, (_, c) => whiteNoise(seededRandom(c + 1), 40));
    const lines = [wide.map((_, c) => `s${c}`).join(",")];
    for (let t = 0; t < 40; t++) lines.push(wide.map((w) => w[t]!.toFixed(3)).join(","));
    const file = csvFile("wide.csv", lines.join("\n"));
    const result = runCliToShell(
      `batch ${file} --format jsonl | head -c 100 > /dev/null; exit \${PIPESTATUS[0]}`,
    );
    expect(result.stderr).toBe("");
    expect(result.status).toBe(0);
  });
});

function runCliToShell(rest: string): CliResult {
  const result = spawnSync("bash", ["-c", `"${process.execPath}" "${CLI_PATH}" ${rest}`], {
    encoding: "utf8",
  });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

describe("echolot batch and audit in long format", () => {
  // Two items, weekly, rows shuffled; item "b" misses the weeks of 2024-02-05 and 2024-02-12.
  const weeks = Array.from({ length: 30 }, (_, t) =>
    new Date(Date.UTC(2024, 0, 1 + 7 * t)).toISOString().slice(0, 10),
  );
  const a = whiteNoise(seededRandom(1), 30);
  const b = whiteNoise(seededRandom(2), 30);
  const missing = new Set([5, 6]);
  const rows: string[] = [];
  weeks.forEach((week, t) => {
    rows.push(`a,${week},${a[t]!.toFixed(4)}`);
    if (!missing.has(t)) rows.push(`b,${week},${b[t]!.toFixed(4)}`);
  });
  const shuffled = rows
    .map((r, i) => ({ r, k: (i * 7919) % rows.length }))
    .sort((x, y) => x.k - y.k)
    .map((x) => x.r);
  const file = csvFile("long.csv", ["item,week,error", ...shuffled].join("\n"));
  const LONG = ["--id", "item", "--time", "week", "--value", "error"];

  it("groups by id, orders by time, and reads missing weeks as gaps, as a column with empty lines would be", () => {
    const doc = JSON.parse(
      ok(runCli(["batch", file, ...LONG, "--json"]), "batch long"),
    ) as BatchDocumentJson;
    expect(doc.source).toMatch(
      /long format, 58 rows, 2 ids in "item", .* weekly \(2 missing periods read as gaps\)/,
    );
    const bColumn = ["b", ...Array.from(b, (v, t) => (missing.has(t) ? "" : v.toFixed(4)))].join(
      "\n",
    );
    const wide = checkJson([csvFile("b-wide.csv", bColumn)]);
    const bRow = doc.series.find((s) => s.label === "b")!;
    expect(bRow.n).toBe(28);
    expect(bRow.statistic).toBe(wide.joint.q);
  });

  it("refuses a duplicate (id, time), naming both lines", () => {
    const dup = csvFile(
      "dup.csv",
      ["item,week,error", "a,2024-01-01,1", "a,2024-01-08,2", "a,2024-01-01,3"].join("\n"),
    );
    refused(
      ["batch", dup, ...LONG],
      /item "a" has two rows for 2024-01-01: lines 2 and 4 of .*dup\.csv; keep one/,
    );
  });

  it("audits every id", () => {
    const text = ok(runCli(["audit", file, ...LONG, "--horizon", "1"]), "audit long");
    expect(text.split("\n")[0]).toMatch(/^read: .*long format/);
    expect(text).toMatch(/^\s+\d+ a\s+30\s/m);
    expect(text).toMatch(/^\s+\d+ b\s+28\s/m);
  });
});

/**
 * The calibration study (`npm run calibration`): seeded simulations of the verdict's size at
 * alpha 5%, 1% and 0.1%, the joint p's far tail, the robust options under volatility clustering,
 * power, the batch's false-discovery proportion and the forecast audit's size and power, for
 * n in {25, 52, 104, 260, 1000} under iid normal, t(3) and skewed noise and GARCH(1,1). Writes
 * the tables between the calibration markers of README.md (and prints them). The bounded version
 * that asserts the limits runs in `npm test` (test/calibration).
 *
 * Cells run on worker threads, one per core. Every cell has its own fixed seed, so the tables are
 * the same on every run and every machine. `--quick` divides every replication count by ten
 * (for trying the script, not for the README). `--part verdict` or `--part headline` runs one
 * part of the study and rewrites only its README block.
 */
import { readFileSync, writeFileSync } from "node:fs";
import { availableParallelism } from "node:os";
import { resolve } from "node:path";
import { Worker, isMainThread, parentPort, workerData } from "node:worker_threads";
import {
  auditRate,
  batchOf,
  biasSizeOf,
  headlineSizeOf,
  powerOf,
  sizeOf,
  wilsonInterval,
  type Alternative,
  type NoiseLaw,
} from "../src/sim/calibration";

type Job =
  | {
      kind: "size";
      n: number;
      law: NoiseLaw;
      alpha: number;
      season: number | null;
      robust: boolean;
      replications: number;
      seed: number;
    }
  | { kind: "power"; n: number; alternative: Alternative; replications: number; seed: number }
  | { kind: "batch"; n: number; replications: number; seed: number }
  | { kind: "headline"; n: number; law: NoiseLaw; replications: number; seed: number }
  | { kind: "bias"; n: number; replications: number; seed: number }
  | {
      kind: "audit";
      n: number;
      horizon: number;
      thetas: number[];
      bias: number;
      phi: number;
      replications: number;
      seed: number;
    };

interface Done {
  index: number;
  value: unknown;
  seconds: number;
}

function runJob(job: Job): unknown {
  switch (job.kind) {
    case "size":
      return sizeOf({
        n: job.n,
        law: job.law,
        options: {
          alpha: job.alpha,
          ...(job.season === null ? {} : { season: job.season }),
          ...(job.robust ? { bandKind: "robust" as const, testKind: "robust" as const } : {}),
        },
        replications: job.replications,
        seed: job.seed,
      });
    case "power":
      return powerOf(job.n, job.alternative, {}, job.replications, job.seed);
    case "batch":
      return batchOf(job.n, job.replications, job.seed);
    case "headline":
      return headlineSizeOf({
        n: job.n,
        law: job.law,
        options: {},
        replications: job.replications,
        seed: job.seed,
      });
    case "bias":
      return biasSizeOf({
        n: job.n,
        law: "normal",
        options: {},
        replications: job.replications,
        seed: job.seed,
      });
    case "audit":
      return auditRate(
        job.n,
        job.horizon,
        job.thetas,
        job.replications,
        job.seed,
        job.bias,
        job.phi,
      );
  }
}

const LENGTHS = [25, 52, 104, 260, 1000] as const;

function plan(scale: number): Job[] {
  const jobs: Job[] = [];
  let seed = 9000;
  const reps = (r: number) => Math.max(20, Math.round(r / scale));
  for (const law of ["normal", "t3", "skewed"] as const) {
    for (const n of LENGTHS) {
      for (const season of [null, 12] as const) {
        if (season !== null && (law !== "normal" || n < 52)) continue;
        const r = n === 1000 ? 800 : 2000;
        jobs.push({
          kind: "size",
          n,
          law,
          alpha: 0.05,
          season,
          robust: false,
          replications: reps(r),
          seed: seed++,
        });
      }
    }
  }
  for (const n of LENGTHS) {
    jobs.push({
      kind: "size",
      n,
      law: "normal",
      alpha: 0.01,
      season: null,
      robust: false,
      replications: reps(n === 1000 ? 500 : 1500),
      seed: seed++,
    });
  }
  for (const n of [52, 104] as const) {
    jobs.push({
      kind: "size",
      n,
      law: "normal",
      alpha: 0.001,
      season: null,
      robust: false,
      replications: reps(n === 52 ? 400 : 300),
      seed: seed++,
    });
  }
  for (const n of LENGTHS) {
    for (const robust of [false, true]) {
      jobs.push({
        kind: "size",
        n,
        law: "garch",
        alpha: 0.05,
        season: null,
        robust,
        replications: reps(n === 1000 ? 400 : 1000),
        seed: seed++,
      });
    }
  }
  const alternatives: Alternative[] = [
    { kind: "ar1", phi: 0.2 },
    { kind: "ma", thetas: [0.3] },
    { kind: "ar1", phi: 0.35 },
  ];
  for (const alternative of alternatives) {
    for (const n of [52, 104, 260] as const) {
      jobs.push({ kind: "power", n, alternative, replications: reps(1000), seed: seed++ });
    }
  }
  for (const n of [52, 104, 260] as const) {
    // n 260: every AR(1) series' p is refined towards 1/20,000 (8 s a replication), so fewer.
    jobs.push({ kind: "batch", n, replications: reps(n === 260 ? 60 : 200), seed: seed++ });
  }
  for (const law of ["normal", "garch"] as const) {
    for (const n of [52, 104, 260] as const) {
      jobs.push({ kind: "headline", n, law, replications: reps(1000), seed: seed++ });
    }
  }
  for (const n of [25, 52, 104, 260] as const) {
    jobs.push({ kind: "bias", n, replications: reps(10000), seed: seed++ });
  }
  for (const thetas of [
    [0.5, 0.25],
    [0.8, 0.64],
  ]) {
    for (const n of [52, 104, 260] as const) {
      jobs.push({
        kind: "audit",
        n,
        horizon: 3,
        thetas,
        bias: 0,
        phi: 0,
        replications: reps(n === 260 ? 500 : 1000),
        seed: seed++,
      });
    }
  }
  jobs.push({
    kind: "audit",
    n: 200,
    horizon: 1,
    thetas: [],
    bias: 0.3,
    phi: 0,
    replications: reps(500),
    seed: seed++,
  });
  jobs.push({
    kind: "audit",
    n: 104,
    horizon: 1,
    thetas: [],
    bias: 0,
    phi: 0.3,
    replications: reps(500),
    seed: seed++,
  });
  jobs.push({
    kind: "audit",
    n: 104,
    horizon: 1,
    thetas: [],
    bias: 0,
    phi: 0,
    replications: reps(1000),
    seed,
  });
  return jobs;
}

function percent(share: number, replications?: number): string {
  const text = `${(100 * share).toFixed(share < 0.01 ? 2 : 1)}%`;
  if (replications === undefined) return text;
  const [low, high] = wilsonInterval(share, replications);
  return `${text} (${(100 * low).toFixed(1)}–${(100 * high).toFixed(1)})`;
}

interface SizeValue {
  replications: number;
  structure: number;
  watch: number;
  pBelow001: number;
  pBelowAlpha: number;
}

/** The study in two parts, each written between its own README markers. */
type Part = "verdict" | "headline";

const PART_OF: Readonly<Record<Job["kind"], Part>> = {
  size: "verdict",
  power: "verdict",
  audit: "verdict",
  batch: "headline",
  headline: "headline",
  bias: "headline",
};

const MARKERS: Readonly<Record<Part, readonly [string, string]>> = {
  verdict: [
    "<!-- calibration tables: written by npm run calibration -->",
    "<!-- end of calibration tables -->",
  ],
  headline: [
    "<!-- headline and batch tables: written by npm run calibration -->",
    "<!-- end of headline and batch tables -->",
  ],
};

function headlineTables(jobs: Job[], values: unknown[]): string {
  const find = <J extends Job>(pick: (job: Job) => job is J, test: (job: J) => boolean) => {
    const index = jobs.findIndex((job) => pick(job) && test(job));
    return index < 0 ? undefined : { job: jobs[index] as J, value: values[index] };
  };
  const lines: string[] = [];
  lines.push(
    "**Batch**: 180 noise and 20 AR(1) φ 0.35 series, kept at q ≤ 0.05 (Benjamini–Hochberg on each series' structure p: the joint test and the largest lag as one test).",
    "",
  );
  lines.push(
    "| n | replications | mean false-discovery proportion | AR(1) series found (of 20) | noise series with raw p < 0.05 (of 180) |",
  );
  lines.push("| ---: | ---: | ---: | ---: | ---: |");
  const isBatch = (job: Job): job is Extract<Job, { kind: "batch" }> => job.kind === "batch";
  for (const n of [52, 104, 260]) {
    const c = find(isBatch, (j) => j.n === n);
    if (c === undefined) continue;
    const v = c.value as { falseDiscoveryProportion: number; found: number; rawNoiseFlags: number };
    lines.push(
      `| ${n} | ${c.job.replications} | ${v.falseDiscoveryProportion.toFixed(3)} | ${v.found.toFixed(1)} | ${v.rawNoiseFlags.toFixed(1)} |`,
    );
  }
  lines.push(
    "",
    "**Headline** (default options): share of series whose headline says `structure`, says `biased`, says either, and reads robustly (Engle's LM fired). Each finding is its own test at 5%, so some finding fires for about 10% of pure noise. On GARCH(1,1) residuals plain bands call up to 19% `structure` (table above); the headline switches to the robust reading when Engle's LM fires, which brings it to 6–8%, not quite 5%: in shorter series the LM test often misses the clustering and the plain reading stays.",
    "",
  );
  lines.push(
    "| noise | n | replications | structure | biased | either | robust reading |",
    "| --- | ---: | ---: | ---: | ---: | ---: | ---: |",
  );
  const isHeadline = (job: Job): job is Extract<Job, { kind: "headline" }> =>
    job.kind === "headline";
  for (const law of ["normal", "garch"] as const) {
    for (const n of [52, 104, 260]) {
      const c = find(isHeadline, (j) => j.law === law && j.n === n);
      if (c === undefined) continue;
      const v = c.value as { structure: number; biased: number; either: number; switched: number };
      const R = c.job.replications;
      lines.push(
        `| ${law === "normal" ? "iid normal" : "GARCH(1,1)"} | ${n} | ${R} | ${percent(v.structure, R)} | ${percent(v.biased, R)} | ${percent(v.either)} | ${percent(v.switched)} |`,
      );
    }
  }
  lines.push(
    "",
    "**Bias check** (white noise, 5%): share flagged, with the fixed-b critical value (the normal reference it replaced gave 9.1% at n 25 and 7.3% at n 52).",
    "",
  );
  lines.push("| n | replications | flagged |", "| ---: | ---: | ---: |");
  const isBias = (job: Job): job is Extract<Job, { kind: "bias" }> => job.kind === "bias";
  for (const n of [25, 52, 104, 260]) {
    const c = find(isBias, (j) => j.n === n);
    if (c === undefined) continue;
    lines.push(
      `| ${n} | ${c.job.replications} | ${percent(c.value as number, c.job.replications)} |`,
    );
  }
  return lines.join("\n");
}

function tables(jobs: Job[], values: unknown[]): string {
  const find = <J extends Job>(pick: (job: Job) => job is J, test: (job: J) => boolean) => {
    const index = jobs.findIndex((job) => pick(job) && test(job));
    return index < 0 ? undefined : { job: jobs[index] as J, value: values[index] };
  };
  const isSize = (job: Job): job is Extract<Job, { kind: "size" }> => job.kind === "size";
  const isAudit = (job: Job): job is Extract<Job, { kind: "audit" }> => job.kind === "audit";
  const lines: string[] = [];
  const sizeCell = (
    law: NoiseLaw,
    n: number,
    alpha: number,
    season: number | null,
    robust: boolean,
  ) =>
    find(
      isSize,
      (j) =>
        j.law === law &&
        j.n === n &&
        j.alpha === alpha &&
        j.season === season &&
        j.robust === robust,
    );

  lines.push(
    "**The verdict on pure noise, default options (α = 5%)**: share called `structure` (95% interval) and `watch`.",
    "",
  );
  lines.push(
    "| n | normal: structure | watch | t(3): structure | watch | skewed: structure | watch | normal, season 12: structure | watch |",
  );
  lines.push("| ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |");
  for (const n of LENGTHS) {
    const cells = (["normal", "t3", "skewed"] as const).map((law) =>
      sizeCell(law, n, 0.05, null, false),
    );
    const seasonal = sizeCell("normal", n, 0.05, 12, false);
    const show = (c: ReturnType<typeof sizeCell>) => {
      if (c === undefined) return "— | —";
      const v = c.value as SizeValue;
      return `${percent(v.structure, v.replications)} | ${percent(v.watch)}`;
    };
    lines.push(`| ${n} | ${cells.map(show).join(" | ")} | ${show(seasonal)} |`);
  }
  lines.push(
    "",
    "**The joint test's p as the verdict and the batch use it**, on iid normal noise: share below 0.05 and below 0.001.",
    "",
  );
  lines.push("| n | replications | p < 0.05 | p < 0.001 |", "| ---: | ---: | ---: | ---: |");
  for (const n of LENGTHS) {
    const c = sizeCell("normal", n, 0.05, null, false);
    if (c === undefined) continue;
    const v = c.value as SizeValue;
    lines.push(
      `| ${n} | ${v.replications} | ${percent(v.pBelowAlpha)} | ${percent(v.pBelow001)} |`,
    );
  }
  lines.push("", "**Other levels** (iid normal): share called `structure` at α = 1% and 0.1%.", "");
  lines.push("| n | α = 1% | α = 0.1% |", "| ---: | ---: | ---: |");
  for (const n of LENGTHS) {
    const one = sizeCell("normal", n, 0.01, null, false);
    const tenth = sizeCell("normal", n, 0.001, null, false);
    const show = (c: ReturnType<typeof sizeCell>) => {
      if (c === undefined) return "—";
      const v = c.value as SizeValue;
      return percent(v.structure, v.replications);
    };
    lines.push(`| ${n} | ${show(one)} | ${show(tenth)} |`);
  }
  lines.push(
    "",
    "**Volatility clustering** (GARCH(1,1), a 0.1, b 0.85): share called `structure` with the default options and with robust bands and the robust joint test.",
    "",
  );
  lines.push("| n | default options | robust options |", "| ---: | ---: | ---: |");
  for (const n of LENGTHS) {
    const plain = sizeCell("garch", n, 0.05, null, false);
    const robust = sizeCell("garch", n, 0.05, null, true);
    const show = (c: ReturnType<typeof sizeCell>) =>
      c === undefined
        ? "—"
        : percent((c.value as SizeValue).structure, (c.value as SizeValue).replications);
    lines.push(`| ${n} | ${show(plain)} | ${show(robust)} |`);
  }
  lines.push("", "**Power**: share called `structure` (default options).", "");
  lines.push("| alternative | n 52 | n 104 | n 260 |", "| --- | ---: | ---: | ---: |");
  const isPower = (job: Job): job is Extract<Job, { kind: "power" }> => job.kind === "power";
  for (const [name, match] of [
    ["AR(1) φ 0.2", (a: Alternative) => a.kind === "ar1" && a.phi === 0.2],
    ["MA(1) θ 0.3", (a: Alternative) => a.kind === "ma"],
    ["AR(1) φ 0.35", (a: Alternative) => a.kind === "ar1" && a.phi === 0.35],
  ] as const) {
    const cells = [52, 104, 260].map((n) =>
      find(isPower, (j) => j.n === n && match(j.alternative)),
    );
    lines.push(
      `| ${name} | ${cells.map((c) => (c === undefined ? "—" : percent(c.value as number))).join(" | ")} |`,
    );
  }
  lines.push("", "**Forecast audit**: share called `structure`.", "");
  lines.push(
    "| errors | horizon | n | replications | structure |",
    "| --- | ---: | ---: | ---: | ---: |",
  );
  for (let i = 0; i < jobs.length; i++) {
    const job = jobs[i] as Job;
    if (!isAudit(job)) continue;
    const name =
      job.bias !== 0
        ? `white noise + bias ${job.bias}σ`
        : job.phi !== 0
          ? `AR(1) φ ${job.phi}`
          : job.thetas.length === 0
            ? "white noise (correct one-step errors)"
            : `MA(2) θ ${job.thetas.join(", ")} (correct 3-step errors)`;
    lines.push(
      `| ${name} | ${job.horizon} | ${job.n} | ${job.replications} | ${percent(values[i] as number, job.replications)} |`,
    );
  }
  return lines.join("\n");
}

function main(): void {
  const scale = process.argv.includes("--quick") ? 10 : 1;
  const parts = chosenParts();
  const jobs = plan(scale).filter((job) => parts.includes(PART_OF[job.kind]));
  const values: unknown[] = new Array(jobs.length);
  const workers = Math.max(1, Math.min(availableParallelism(), 4));
  let next = 0;
  let finished = 0;
  const started = Date.now();
  // Longest jobs first, so that the last worker does not run alone for long.
  const order = jobs.map((job, index) => ({
    index,
    cost: job.n * job.replications * (job.kind === "batch" ? 200 : job.kind === "bias" ? 0.01 : 1),
  }));
  order.sort((a, b) => b.cost - a.cost);
  const start = (worker: Worker) => {
    const item = order[next++];
    if (item === undefined) {
      void worker.terminate();
      return;
    }
    worker.postMessage({ index: item.index, job: jobs[item.index] });
  };
  for (let w = 0; w < workers; w++) {
    const worker = new Worker(process.argv[1] as string, { workerData: { worker: true } });
    worker.on("message", (done: Done) => {
      values[done.index] = done.value;
      finished++;
      process.stderr.write(
        `\r${finished}/${jobs.length} cells, ${Math.round((Date.now() - started) / 1000)} s`,
      );
      if (finished === jobs.length) report(jobs, values, scale, parts);
      start(worker);
    });
    worker.on("error", (error) => {
      console.error(error);
      process.exit(1);
    });
    start(worker);
  }
}

function report(jobs: Job[], values: unknown[], scale: number, parts: readonly Part[]): void {
  process.stderr.write("\n");
  for (const part of parts) {
    const text = part === "verdict" ? tables(jobs, values) : headlineTables(jobs, values);
    console.log(text);
    if (scale !== 1) continue;
    const readme = resolve(process.cwd(), "README.md");
    const current = readFileSync(readme, "utf8");
    const [begin, end] = MARKERS[part];
    const from = current.indexOf(begin);
    const to = current.indexOf(end);
    if (from < 0 || to < 0) {
      console.error(`README.md has no markers ${begin} … ${end}; tables printed only`);
      continue;
    }
    writeFileSync(
      readme,
      `${current.slice(0, from + begin.length)}\n\n${text}\n\n${current.slice(to)}`,
    );
    console.error(`README.md: ${part} tables written`);
  }
}

/** `--part verdict` or `--part headline` runs and writes one part; the default, both. */
function chosenParts(): Part[] {
  const at = process.argv.indexOf("--part");
  if (at < 0) return ["verdict", "headline"];
  const value = process.argv[at + 1];
  if (value !== "verdict" && value !== "headline") {
    throw new Error(`--part takes verdict or headline (got ${String(value)})`);
  }
  return [value];
}

if (isMainThread) {
  main();
} else if ((workerData as { worker?: boolean } | null)?.worker === true) {
  parentPort?.on("message", ({ index, job }: { index: number; job: Job }) => {
    const started = Date.now();
    const value = runJob(job);
    parentPort?.postMessage({
      index,
      value,
      seconds: (Date.now() - started) / 1000,
    } satisfies Done);
  });
}

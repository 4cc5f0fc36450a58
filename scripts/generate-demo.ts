/**
 * Writes the two invented demo scenarios as CSV files under demo/ (seeded, so the files are the
 * same on every run). `--check` regenerates in memory and fails if the committed files differ.
 *
 * - Ternpoint Roasters: 104 weeks of forecast errors (bags) for 24 blends: 14 clean, 4 that
 *   under-react (AR(1) errors, φ = 0.55), 4 with an unforecast 13-week promotion spike, 2 biased
 *   (mean error +0.6 σ, otherwise clean).
 * - Larkvale Balanced Fund: 750 days of return-model residuals (percent) with GARCH(1,1)-like
 *   volatility clustering and no linear dependence.
 */
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { seededRandom } from "../src/sim/random";
import { ar1, garch11, whiteNoise } from "../src/sim/processes";

const SEED = 20261201;
const WEEKS = 104;
const DAYS = 750;

type Kind = "clean" | "under-reacts" | "promotion" | "biased";

const BLENDS: readonly (readonly [string, Kind])[] = [
  ["Harbour Dawn", "clean"],
  ["Copper Kettle", "under-reacts"],
  ["Night Ferry", "clean"],
  ["Quarry Road", "promotion"],
  ["Saltmarsh", "clean"],
  ["Lantern Hill", "biased"],
  ["Old Mill", "clean"],
  ["Birch Parlour", "under-reacts"],
  ["Tidewater", "clean"],
  ["Foundry Black", "promotion"],
  ["Meadowlark", "clean"],
  ["Cinder Path", "clean"],
  ["Greywell", "under-reacts"],
  ["Orchard Gate", "clean"],
  ["Stonebridge", "promotion"],
  ["Fen Lantern", "clean"],
  ["Kestrel Row", "biased"],
  ["Low Tide", "clean"],
  ["Wickerwork", "under-reacts"],
  ["Mossbank", "clean"],
  ["Signal Box", "promotion"],
  ["Ember Lane", "clean"],
  ["Pebble Beach", "clean"],
  ["Thistle Down", "clean"],
];

function blendErrors(kind: Kind, scale: number, random: ReturnType<typeof seededRandom>): number[] {
  const base = kind === "under-reacts" ? ar1(random, WEEKS, 0.55) : whiteNoise(random, WEEKS);
  const phase = Math.floor(random.uniform() * 13);
  return Array.from(base, (e, week) => {
    let value = e;
    if (kind === "promotion" && week % 13 === phase) value += 3.2;
    if (kind === "biased") value += 0.6;
    return Math.round(value * scale);
  });
}

/** ISO date (YYYY-MM-DD) `days` after 2024-01-07 (a Sunday, the week's closing day). */
function weekEnding(week: number): string {
  return new Date(Date.UTC(2024, 0, 7 + 7 * week)).toISOString().slice(0, 10);
}

/** The first `count` business days (Monday to Friday) from 2023-01-02. */
function businessDays(count: number): string[] {
  const days: string[] = [];
  for (let offset = 0; days.length < count; offset++) {
    const date = new Date(Date.UTC(2023, 0, 2 + offset));
    const weekday = date.getUTCDay();
    if (weekday !== 0 && weekday !== 6) days.push(date.toISOString().slice(0, 10));
  }
  return days;
}

function ternpoint(): string {
  const random = seededRandom(SEED);
  const columns = BLENDS.map(([, kind]) =>
    blendErrors(kind, 20 + Math.round(random.uniform() * 40), random),
  );
  const header = ["week ending", ...BLENDS.map(([name]) => name)];
  const rows = [header.join(",")];
  for (let week = 0; week < WEEKS; week++) {
    rows.push([weekEnding(week), ...columns.map((c) => String(c[week]))].join(","));
  }
  return `${rows.join("\n")}\n`;
}

function larkvale(): string {
  const random = seededRandom(SEED + 1);
  const residuals = garch11(random, DAYS, 0.02, 0.2, 0.78);
  const days = businessDays(DAYS);
  const rows = ["date,residual"];
  residuals.forEach((r, day) => rows.push(`${days[day]},${(r * 0.6).toFixed(4)}`));
  return `${rows.join("\n")}\n`;
}

const FILES: Readonly<Record<string, () => string>> = {
  "ternpoint-roasters-forecast-errors.csv": ternpoint,
  "larkvale-fund-residuals.csv": larkvale,
};

function readOrEmpty(path: string): string {
  try {
    return readFileSync(path, "utf8");
  } catch {
    return "";
  }
}

const directory = join(__dirname, "..", "demo");
const check = process.argv.includes("--check");
mkdirSync(directory, { recursive: true });
let stale = 0;
for (const [name, make] of Object.entries(FILES)) {
  const path = join(directory, name);
  const text = make();
  if (check) {
    const current = readOrEmpty(path);
    if (current !== text) {
      stale++;
      process.stderr.write(
        `demo/${name} differs from what the generator writes: run npm run demo:generate\n`,
      );
    }
  } else {
    writeFileSync(path, text);
    process.stdout.write(`wrote demo/${name}\n`);
  }
}
process.exitCode = stale > 0 ? 1 : 0;

/**
 * The calibration study's cells: seeded simulations of what Echolot promises on noise (the size of
 * `structure` and `watch`, the share of tiny joint p-values, the batch's false-discovery
 * proportion, the forecast audit's size) and what it finds when there is something (power). Used
 * by the full study (`npm run calibration`, scripts/calibration.ts), which writes the README's
 * tables, and by the bounded tests in test/calibration/, which assert the limits.
 *
 * Laws of the noise: iid normal; Student's t with 3 df (heavy tails); a skewed law (centred
 * exponential); GARCH(1,1) with a = 0.1, b = 0.85 (uncorrelated, with volatility clustering;
 * Bollerslev 1986, J. Econometrics 31:307–327).
 */
import {
  batchCheck,
  biasCheck,
  forecastAudit,
  noiseCheck,
  seriesFromNumbers,
  seriesHeadline,
  type LagOptions,
  type Series,
} from "../core";
import { ar1, garch11, movingAverage } from "./processes";
import { seededRandom, type Random } from "./random";

export type NoiseLaw = "normal" | "t3" | "skewed" | "garch";

export const NOISE_LAWS: readonly NoiseLaw[] = ["normal", "t3", "skewed", "garch"];

/** n values of the law, scaled to variance 1 where the variance exists. */
export function noise(random: Random, n: number, law: NoiseLaw): Float64Array {
  if (law === "garch") return garch11(random, n, 0.05, 0.1, 0.85);
  const x = new Float64Array(n);
  for (let t = 0; t < n; t++) {
    if (law === "normal") x[t] = random.normal();
    else if (law === "skewed") x[t] = -Math.log(1 - random.uniform()) - 1;
    else {
      let chi = 0;
      for (let j = 0; j < 3; j++) chi += random.normal() ** 2;
      x[t] = random.normal() / Math.sqrt(chi / 3);
    }
  }
  return x;
}

export interface SizeCell {
  readonly n: number;
  readonly law: NoiseLaw;
  readonly options: LagOptions;
  readonly replications: number;
  readonly seed: number;
}

export interface SizeResult {
  readonly replications: number;
  /** Share judged `structure`, `watch`. */
  readonly structure: number;
  readonly watch: number;
  /** Share of joint p-values (as the verdict uses them) below 0.001 and below alpha. */
  readonly pBelow001: number;
  readonly pBelowAlpha: number;
  /** Count behind `pBelow001`. */
  readonly countBelow001: number;
}

/** The verdict on `replications` noise series of the cell's law. */
export function sizeOf(cell: SizeCell): SizeResult {
  const random = seededRandom(cell.seed);
  const alpha = cell.options.alpha ?? 0.05;
  let structure = 0;
  let watch = 0;
  let below001 = 0;
  let belowAlpha = 0;
  for (let r = 0; r < cell.replications; r++) {
    const check = noiseCheck(seriesFromNumbers(noise(random, cell.n, cell.law)), cell.options);
    if (check.verdict.word === "structure") structure++;
    if (check.verdict.word === "watch") watch++;
    if (check.levels.jointP.p < 0.001) below001++;
    if (check.levels.jointP.p < alpha) belowAlpha++;
  }
  const R = cell.replications;
  return {
    replications: R,
    structure: structure / R,
    watch: watch / R,
    pBelow001: below001 / R,
    pBelowAlpha: belowAlpha / R,
    countBelow001: below001,
  };
}

/** Shares of pure-noise series whose headline (core/headline.ts) says each thing. */
export interface HeadlineSizeResult {
  readonly replications: number;
  /** Word `structure` (in the reading the headline uses). */
  readonly structure: number;
  /** Flagged biased. */
  readonly biased: number;
  /** Either: some finding fired. */
  readonly either: number;
  /** The reading was switched to robust by the volatility check. */
  readonly switched: number;
}

/** The headline on `replications` seeded series of the cell's noise law. */
export function headlineSizeOf(cell: SizeCell): HeadlineSizeResult {
  const random = seededRandom(cell.seed);
  let structure = 0;
  let biased = 0;
  let either = 0;
  let switched = 0;
  for (let r = 0; r < cell.replications; r++) {
    const series = seriesFromNumbers(noise(random, cell.n, cell.law));
    const { headline } = seriesHeadline(series, cell.options);
    if (headline.word === "structure") structure++;
    if (headline.biased) biased++;
    if (headline.word === "structure" || headline.biased) either++;
    if (headline.switched) switched++;
  }
  const R = cell.replications;
  return {
    replications: R,
    structure: structure / R,
    biased: biased / R,
    either: either / R,
    switched: switched / R,
  };
}

/** Share of `replications` seeded noise series whose bias check flags at its alpha. */
export function biasSizeOf(cell: SizeCell): number {
  const random = seededRandom(cell.seed);
  let flagged = 0;
  for (let r = 0; r < cell.replications; r++) {
    const series = seriesFromNumbers(noise(random, cell.n, cell.law));
    if (biasCheck(series, { alpha: cell.options.alpha ?? null }).flagged) flagged++;
  }
  return flagged / cell.replications;
}

export type Alternative =
  | { readonly kind: "ar1"; readonly phi: number }
  | { readonly kind: "ma"; readonly thetas: readonly number[] };

export function alternativeSeries(
  random: Random,
  n: number,
  alternative: Alternative,
): Float64Array {
  return alternative.kind === "ar1"
    ? ar1(random, n, alternative.phi)
    : movingAverage(random, n, alternative.thetas);
}

/** Share of `replications` series of the alternative judged `structure`. */
export function powerOf(
  n: number,
  alternative: Alternative,
  options: LagOptions,
  replications: number,
  seed: number,
): number {
  const random = seededRandom(seed);
  let structure = 0;
  for (let r = 0; r < replications; r++) {
    const check = noiseCheck(seriesFromNumbers(alternativeSeries(random, n, alternative)), options);
    if (check.verdict.word === "structure") structure++;
  }
  return structure / replications;
}

export interface BatchResult {
  readonly replications: number;
  /** Mean over replications of (noise series flagged / series flagged), 0 when none flagged. */
  readonly falseDiscoveryProportion: number;
  /** Standard error of that mean (sample sd of the per-replication proportions over √R). */
  readonly fdpStandardError: number;
  /** Mean number of the AR(1) series flagged (q ≤ alpha). */
  readonly found: number;
  /** Mean number of noise series with raw p < alpha. */
  readonly rawNoiseFlags: number;
}

/** `noiseCount` noise series and `signalCount` AR(1) φ series per replication, flagged at q ≤ 0.05. */
export function batchOf(
  n: number,
  replications: number,
  seed: number,
  noiseCount = 180,
  signalCount = 20,
  phi = 0.35,
): BatchResult {
  const random = seededRandom(seed);
  let fdp = 0;
  let fdpSquares = 0;
  let found = 0;
  let raw = 0;
  for (let rep = 0; rep < replications; rep++) {
    const list: Series[] = [];
    for (let i = 0; i < noiseCount; i++) list.push(seriesFromNumbers(noise(random, n, "normal")));
    for (let i = 0; i < signalCount; i++) list.push(seriesFromNumbers(ar1(random, n, phi)));
    const batch = batchCheck(list);
    let falseFlags = 0;
    let trueFlags = 0;
    batch.rows.forEach((row, i) => {
      const flagged = row.qValue <= batch.alpha;
      if (i < noiseCount) {
        if (flagged) falseFlags++;
        if (row.p < batch.alpha) raw++;
      } else if (flagged) trueFlags++;
    });
    const flags = falseFlags + trueFlags;
    const proportion = flags === 0 ? 0 : falseFlags / flags;
    fdp += proportion;
    fdpSquares += proportion * proportion;
    found += trueFlags;
  }
  const mean = fdp / replications;
  const variance =
    replications > 1 ? (fdpSquares - replications * mean * mean) / (replications - 1) : 0;
  return {
    replications,
    falseDiscoveryProportion: mean,
    fdpStandardError: Math.sqrt(Math.max(0, variance) / replications),
    found: found / replications,
    rawNoiseFlags: raw / replications,
  };
}

/** Share of `replications` audits called `structure`; errors = MA(thetas) + bias. */
export function auditRate(
  n: number,
  horizon: number,
  thetas: readonly number[],
  replications: number,
  seed: number,
  bias = 0,
  phi = 0,
): number {
  const random = seededRandom(seed);
  let structure = 0;
  for (let r = 0; r < replications; r++) {
    const x = phi === 0 ? movingAverage(random, n, thetas) : ar1(random, n, phi);
    if (bias !== 0) for (let t = 0; t < n; t++) x[t] = (x[t] as number) + bias;
    const audit = forecastAudit(seriesFromNumbers(x), { horizon });
    if (audit.verdict.word === "structure") structure++;
  }
  return structure / replications;
}

/** A 95% Wilson interval for a share (Wilson 1927, JASA 22:209–212). */
export function wilsonInterval(share: number, replications: number): [number, number] {
  const z = 1.959963984540054;
  const z2 = z * z;
  const centre = (share + z2 / (2 * replications)) / (1 + z2 / replications);
  const half =
    (z * Math.sqrt((share * (1 - share)) / replications + z2 / (4 * replications * replications))) /
    (1 + z2 / replications);
  return [Math.max(0, centre - half), Math.min(1, centre + half)];
}

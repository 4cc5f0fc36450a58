/**
 * The verdict's reference: the levels at which `structure` and `watch` are judged, chosen so that
 * for pure noise each fires with probability alpha, and the joint test's p-value as the verdict
 * uses it.
 *
 * `structure` joins two rules — the joint test over K lags, and the largest |z_k| beyond the
 * all-lags (outer) corridor. Each at alpha, joined by OR, they fire about 1.5·alpha of the time on
 * noise. Here both run at one common level a*, chosen from the null distribution of the pair:
 *
 * - Permutation reference (series of ordinary length, no fitted parameters). Under the white-noise
 *   null every ordering of the values present is equally likely (exchangeability; Dufour & Roy
 *   1985, J. Econometrics 29:257–273), so the statistics of B uniformly permuted copies (present
 *   values permuted among present positions: gaps stay where they are) and of the observed series
 *   are exchangeable, whatever the distribution of the noise. Each rule's p is its rank among the
 *   B + 1: u = #{Q_j ≥ Q}/(B+1) for the joint test, v = #{M_j ≥ M}/(B+1) for M = max_k |z_k|, and
 *   the pair is judged by S = min(u, v). `structure` fires when the rank of S among the B + 1
 *   gives (1 + #{S_b ≤ S₀})/(B+1) ≤ alpha: a Monte Carlo test of the min-p statistic (the
 *   resampling min-p of Westfall & Young 1993, *Resampling-Based Multiple Testing*, Wiley, §2.6),
 *   exact at alpha when alpha·(B+1) is whole (Dufour 2006, J. Econometrics 133:443–477). The same
 *   decision reads as "u < a* or v < a*" with a* the (alpha·(B+1))-th smallest S_b: the joint
 *   test rejects above the critical Q, a lag is beyond the outer corridor above the critical M.
 *   B + 1 = 500 at alpha = 5% (more for smaller alpha, so that alpha·(B+1) ≥ 25).
 * - Normal-limit reference (very long series, or residuals of a model with fitted parameters,
 *   which are not exchangeable). z_k are then close to independent N(0, 1) (Box, Jenkins &
 *   Reinsel, §2.1.6) and Q to χ² with K − fittedParams df, so a* is the alpha-quantile of
 *   min(χ² tail of Q, Šidák-adjusted two-sided normal p of M) over 19,999 simulated vectors,
 *   computed once per (K, df, alpha, key lags) and kept.
 *
 * `watch` is calibrated the same way, as one rule: lag 1 or a seasonal lag (the key lags) beyond a
 * line, or more lags beyond the inner corridor than chance explains. Its statistic is
 * W = min(two-sided normal p of the largest key-lag |z|, binomial chance of the crossing count),
 * and w* is its alpha-quantile, so the watch rule alone fires on noise with probability at most
 * alpha.
 *
 * The joint test's p as the verdict and the batch use it: for the permutation reference u, refined
 * when it is small by further draws with sequential stopping after h exceedances (Besag & Clifford
 * 1991, Biometrika 78:301–304: p = h/L when the h-th exceedance comes at draw L, else
 * (G + 1)/(L_max + 1)), which keeps p exact on its support and shows small p-values to 1/20,000;
 * a p with no exceedance in all draws is a bound. For the normal-limit reference, the χ² tail.
 *
 * The structure p, for a batch's false-discovery step: the structure rule as one test, with the
 * statistic T = min(χ² tail of Q, Šidák-adjusted two-sided normal p of M) — a fixed, continuous
 * function of the data, so its permutation p is exact and can be refined like the joint p
 * (Besag–Clifford, to 1/20,000). A batch that ranked series by the joint p alone would miss a
 * series whose evidence is one strong lag (an AR(1) error at lag 1 among 26 lags tested), which
 * its own verdict calls structure. Under the normal limit the two p-values are joined by
 * Bonferroni: min(1, 2·T), valid whatever their dependence.
 * Draws are seeded from the data and options (seededDraws.ts), so results never change on
 * recalculation. Cost: B·O(n·K) for the permutation reference, up to 20,000·O(n·K) more for a
 * remarkable series' p; O(19,999·K) once per key for the normal limit.
 */
import {
  binomialUpperTail,
  chiSquareUpperTail,
  normalQuantile,
  normalTwoSided,
} from "./distributions";
import { lagStatistics, lagStatisticsWork, type LagStatisticsSpec } from "./lagStatistics";
import { sidakAdjust, sidakLevel } from "./multiplicity";
import {
  countAtLeast,
  kthLargestOfRest,
  kthSmallest,
  sortAscending,
  upperCountsSorted,
} from "./ranks";
import { type DrawStream, SeedHash } from "./seededDraws";

export type ReferenceKind = "permutation" | "normal-limit" | "monte-carlo";
export type PReference = "permutation" | "chi-square" | "monte-carlo" | "normal-limit";

/** A p-value with what it comes from. */
export interface ReferencedP {
  readonly p: number;
  readonly reference: PReference;
  /** Draws behind p (0 for a χ² tail). */
  readonly draws: number;
  /** p is only an upper bound: no draw reached the observed statistic, or the 1e-300 floor. */
  readonly bound: boolean;
}

export interface VerdictLevels {
  readonly reference: ReferenceKind;
  /** Draws behind the levels. */
  readonly draws: number;
  /** a*, the common level of the joint test and the outer corridor (on the p scale). */
  readonly structureLevel: number;
  /** The joint test rejects when Q exceeds this. */
  readonly criticalQ: number;
  /** z of the outer corridor: a lag with |z_k| beyond it fires `structure`. */
  readonly outerLevel: number;
  /** w*, the level of the watch rule's key lags and crossing count. */
  readonly watchLevel: number;
  /** The joint test's p as the verdict uses it. */
  readonly jointP: ReferencedP;
  /** Whether the joint test rejects at a* (Q above the critical Q). */
  readonly jointRejects: boolean;
}

/** The levels of one series' verdict, with the p of its structure rule. */
export interface SeriesLevels extends VerdictLevels {
  /**
   * The p of the structure rule as one test — the joint test and the largest lag together — for a
   * batch's false-discovery step (see the file's comment, "The structure p").
   */
  readonly structureP: ReferencedP;
}

export interface VerdictReferenceInput {
  /** The subject's deviations at present positions (any fixed scale), 0 at gaps. */
  readonly deviations: Float64Array;
  readonly present: Uint8Array;
  readonly spec: LagStatisticsSpec;
  readonly alpha: number;
  readonly fittedParams: number;
  /** z_{1−α/2}, the inner corridor. */
  readonly innerLevel: number;
  /** Lag 1 and the seasonal lags within K. */
  readonly keyLags: readonly number[];
  /** The observed joint statistic, as the core computed it, and its df. */
  readonly q: number;
  /** The observed largest |z_k| (the structure p under the normal limit needs it). */
  readonly largest: number;
  readonly df: number;
}

/** Above this many multiply-adds per draw (n·K) the normal limit is used: long series are costly to permute and close to it. */
export const PERMUTATION_WORK_LIMIT = 250_000;
/** Draws beyond the base ones that may refine a small joint p. */
const MAX_DRAWS = 19_999;
const NORMAL_LIMIT_DRAWS = 19_999;

/**
 * B, with B + 1 the smallest multiple of 500 for which alpha·(B + 1) ≥ 25: 499 at the default 5%,
 * 2,499 at 1%. Twenty-five draws beyond the level keep a* steady; a Monte Carlo test's power
 * with B of this size is close to that of the exact reference (Jöckel 1986, Ann. Stat.
 * 14:336–347).
 */
export function baseDrawCount(alpha: number): number {
  return 500 * Math.max(1, Math.ceil(25 / (alpha * 500) - 1e-9)) - 1;
}

/** Below this alpha a permutation reference would need too many draws: the normal limit. */
export const SMALLEST_PERMUTATION_ALPHA = 0.001;

/** Which reference the verdict of a series with n values present uses. */
export function referenceKind(
  n: number,
  maxLag: number,
  fittedParams: number,
  alpha: number,
): ReferenceKind {
  return fittedParams === 0 &&
    n * maxLag <= PERMUTATION_WORK_LIMIT &&
    alpha >= SMALLEST_PERMUTATION_ALPHA
    ? "permutation"
    : "normal-limit";
}

/** What the statistics of one arrangement say, in the forms the two rules compare. */
export interface DrawSummary {
  q: number;
  /** max |z_k| over lags with pairs. */
  largest: number;
  /** max |z_k| over the key lags. */
  keyLargest: number;
  /** Lags beyond the inner corridor. */
  crossings: number;
}

export function summarise(
  z: Float64Array,
  keyLags: readonly number[],
  inner: number,
  out: DrawSummary,
): void {
  let largest = 0;
  let crossings = 0;
  for (let k = 0; k < z.length; k++) {
    const size = Math.abs(z[k] as number);
    if (!(size >= 0)) continue;
    if (size > largest) largest = size;
    if (size > inner) crossings++;
  }
  let keyLargest = 0;
  for (const lag of keyLags) {
    const size = Math.abs(z[lag - 1] as number);
    if (size > keyLargest) keyLargest = size;
  }
  out.largest = largest;
  out.keyLargest = keyLargest;
  out.crossings = crossings;
}

const knownChances = new Map<string, Float64Array>();

/**
 * Binomial chance of at least c crossings among `tested` lags, for c = 0..tested (+1). Every
 * series of a batch asks for the same few: they are kept per (tested, alpha), read-only.
 */
export function crossingChances(tested: number, alpha: number): Float64Array {
  const key = `${tested}|${alpha}`;
  const known = knownChances.get(key);
  if (known !== undefined) return known;
  const chances = new Float64Array(tested + 2);
  for (let c = 0; c <= tested + 1; c++) chances[c] = binomialUpperTail(c, tested, alpha);
  if (knownChances.size > 256) knownChances.clear();
  knownChances.set(key, chances);
  return chances;
}

function testedLags(spec: LagStatisticsSpec): number {
  let tested = 0;
  for (let k = 1; k <= spec.maxLag; k++) if ((spec.pairs[k] as number) > 0) tested++;
  return tested;
}

/** The permutation reference (see the file's comment). */
function permutationLevels(input: VerdictReferenceInput, stream: DrawStream): SeriesLevels {
  const { deviations, present, spec, alpha, keyLags, innerLevel } = input;
  const length = deviations.length;
  const n = spec.n;
  const positions = new Int32Array(n);
  const values = new Float64Array(n);
  for (let t = 0, i = 0; t < length; t++) {
    if (present[t] === 1) {
      positions[i] = t;
      values[i++] = deviations[t] as number;
    }
  }
  const arrangement = Float64Array.from(deviations);
  const work = lagStatisticsWork(length, spec.maxLag);
  const B = baseDrawCount(alpha);
  const q = new Float64Array(B + 1);
  const largest = new Float64Array(B + 1);
  const keyP = new Float64Array(B + 1);
  const crossings = new Int32Array(B + 1);
  const chances = crossingChances(testedLags(spec), alpha);
  const summary: DrawSummary = { q: 0, largest: 0, keyLargest: 0, crossings: 0 };
  const record = (b: number) => {
    q[b] = lagStatistics(arrangement, spec, work);
    summarise(work.z, keyLags, innerLevel, summary);
    largest[b] = summary.largest;
    keyP[b] = keyLags.length > 0 ? normalTwoSided(summary.keyLargest) : 1;
    crossings[b] = summary.crossings;
  };
  const gapFree = n === length;
  const shuffle = () => {
    if (gapFree) {
      stream.shuffle(arrangement);
      return;
    }
    stream.shuffle(values);
    for (let i = 0; i < n; i++) arrangement[positions[i] as number] = values[i] as number;
  };
  record(0);
  for (let b = 1; b <= B; b++) {
    shuffle();
    record(b);
  }

  const w = new Float64Array(B + 1);
  for (let b = 0; b <= B; b++) {
    w[b] = Math.min(keyP[b] as number, chances[crossings[b] as number] as number);
  }
  const common = commonLevel([q, largest], alpha);
  const [criticalQ, outerLevel] = common.criticals as [number, number];
  const u0 = countAtLeast(q, q[0] as number);
  const base = { p: u0 / (B + 1), reference: "permutation" as const, draws: B, bound: false };
  const jointP = refineJointP(base, u0 - 1, q[0] as number, alpha, () => {
    shuffle();
    return lagStatistics(arrangement, spec, work, true);
  });
  // The structure p, after the joint p so that the joint p's draws stay as they were.
  const tested = testedLags(spec);
  const T = (b: number) =>
    structureStatistic(q[b] as number, largest[b] as number, input.df, tested);
  const t0 = T(0);
  let atMost = 0;
  for (let b = 0; b <= B; b++) if (T(b) <= t0) atMost++;
  const structureBase = { ...base, p: atMost / (B + 1) };
  // T is small for extreme series: the refinement counts draws at or below it (negated).
  const structureP = refineJointP(structureBase, atMost - 1, -t0, alpha, () => {
    shuffle();
    const drawnQ = lagStatistics(arrangement, spec, work);
    summarise(work.z, keyLags, innerLevel, summary);
    return -structureStatistic(drawnQ, summary.largest, input.df, tested);
  });
  return {
    reference: "permutation",
    draws: B,
    structureLevel: common.level,
    criticalQ,
    outerLevel,
    watchLevel: drawnLevel(w, alpha),
    jointP,
    jointRejects: (q[0] as number) > criticalQ,
    structureP,
  };
}

/**
 * T = min(χ² tail of Q, Šidák-adjusted two-sided normal p of the largest |z|): the structure rule
 * as one statistic on the p scale (smaller = more extreme).
 */
export function structureStatistic(q: number, largest: number, df: number, tested: number): number {
  return Math.min(chiSquareUpperTail(q, df), sidakAdjust(normalTwoSided(largest), tested));
}

/**
 * One common level for several statistics (larger = more extreme) drawn B times, index 0 the
 * observed: each statistic's p is its rank among the B + 1, S is the smallest of them, and the
 * common level a* is the (alpha·(B+1))-th smallest S among the draws, so that "some statistic's
 * p < a*" holds for the observed with probability alpha when it is exchangeable with the draws.
 * Returns a* (on the p scale) and, for each statistic, the critical value it must exceed.
 */
export function commonLevel(
  columns: readonly Float64Array[],
  alpha: number,
): { level: number; criticals: number[] } {
  const size = (columns[0] as Float64Array).length;
  const s = new Float64Array(size).fill(Infinity);
  // Each column sorted once, for its ranks and for its critical value.
  const sorted = columns.map((column) => sortAscending(column.slice()));
  columns.forEach((column, c) => {
    const counts = upperCountsSorted(column, sorted[c] as Float64Array);
    for (let b = 0; b < size; b++) s[b] = Math.min(s[b] as number, counts[b] as number);
  });
  const allowed = Math.floor(alpha * size + 1e-9);
  const aCount = allowed >= 1 ? kthSmallest(s, allowed, 1) : 0;
  return {
    level: Number.isFinite(aCount) ? aCount / size : 1,
    criticals: columns.map((column, c) =>
      kthLargestOfRest(column, sorted[c] as Float64Array, aCount - 1),
    ),
  };
}

/** The (alpha·(B+1))-th smallest of the draws' p-scale statistic `w` (index 0 the observed). */
export function drawnLevel(w: Float64Array, alpha: number): number {
  const allowed = Math.floor(alpha * w.length + 1e-9);
  const level = allowed >= 1 ? kthSmallest(w, allowed, 1) : 0;
  return Number.isFinite(level) ? level : 1;
}

/**
 * Besag–Clifford refinement of a small permutation p: with G exceedances in the base draws and
 * fewer than h, keep drawing until the h-th exceedance (p = h/L) or MAX_DRAWS (p = (G+1)/(L+1)).
 * h = alpha·(B+1)/5 (at least 4), so that a refined p stays on the same side of a* as the base one.
 */
export function refineJointP(
  base: ReferencedP,
  exceedances: number,
  observed: number,
  alpha: number,
  draw: () => number,
): ReferencedP {
  const h = Math.max(4, Math.floor((alpha * (base.draws + 1)) / 5));
  if (exceedances >= h) return base;
  let G = exceedances;
  let L = base.draws;
  while (L < MAX_DRAWS) {
    L++;
    if (draw() >= observed) {
      G++;
      if (G === h) return { p: h / L, reference: "permutation", draws: L, bound: false };
    }
  }
  return { p: (G + 1) / (L + 1), reference: "permutation", draws: L, bound: G === 0 };
}

interface NormalLimit {
  readonly structureLevel: number;
  readonly criticalQ: number;
  readonly outerLevel: number;
  readonly watchLevel: number;
}

const normalLimits = new Map<string, NormalLimit>();

/** a*, w* and the derived lines under the normal limit, for `tested` lags (see the file's comment). */
function normalLimit(
  tested: number,
  df: number,
  alpha: number,
  keyLags: readonly number[],
  innerLevel: number,
): NormalLimit {
  const key = `${tested}|${df}|${alpha}|${keyLags.join(",")}`;
  const known = normalLimits.get(key);
  if (known !== undefined) return known;
  const stream = new SeedHash().word("normal-limit").word(key).stream();
  const chances = crossingChances(tested, alpha);
  const s = new Float64Array(NORMAL_LIMIT_DRAWS);
  const w = new Float64Array(NORMAL_LIMIT_DRAWS);
  const z = new Float64Array(tested);
  const summary: DrawSummary = { q: 0, largest: 0, keyLargest: 0, crossings: 0 };
  for (let b = 0; b < NORMAL_LIMIT_DRAWS; b++) {
    let q = 0;
    for (let k = 0; k < tested; k++) {
      const x = stream.normal();
      z[k] = x;
      q += x * x;
    }
    summarise(
      z,
      keyLags.filter((lag) => lag <= tested),
      innerLevel,
      summary,
    );
    s[b] = Math.min(
      chiSquareUpperTail(q, df),
      sidakAdjust(normalTwoSided(summary.largest), tested),
    );
    w[b] = Math.min(
      keyLags.length > 0 ? normalTwoSided(summary.keyLargest) : 1,
      chances[summary.crossings] as number,
    );
  }
  const structureLevel = limitLevel(s, alpha, 2);
  const watchLevel = limitLevel(w, alpha, 2);
  const limit = {
    structureLevel,
    criticalQ: chiSquareQuantileUpper(structureLevel, df),
    outerLevel: normalQuantile(1 - sidakLevel(structureLevel, tested) / 2),
    watchLevel,
  };
  if (normalLimits.size > 256) normalLimits.clear();
  normalLimits.set(key, limit);
  return limit;
}

/**
 * The alpha-quantile of a min-p statistic simulated under the normal limit (`draws` holds one
 * value per simulated vector), at most alpha. With fewer than 25 draws beyond the level (alpha
 * below 0.00125) the quantile is not worth drawing for: each of the `rules` then takes
 * alpha/rules (Bonferroni), which holds alpha together.
 */
export function limitLevel(draws: Float64Array, alpha: number, rules: number): number {
  const allowed = Math.floor(alpha * (draws.length + 1) + 1e-9);
  return allowed >= 25 ? Math.min(alpha, kthSmallest(draws, allowed)) : alpha / rules;
}

/** x with P(χ²_df ≥ x) = p, by bisection on the upper tail (60 halvings: to the last bit). */
export function chiSquareQuantileUpper(p: number, df: number): number {
  let low = 0;
  let high = df + 10 * Math.sqrt(2 * df) + 100;
  while (chiSquareUpperTail(high, df) > p) high *= 2;
  for (let i = 0; i < 200 && high - low > 1e-12 * high; i++) {
    const middle = (low + high) / 2;
    if (chiSquareUpperTail(middle, df) > p) low = middle;
    else high = middle;
  }
  return high;
}

/** The seed of a series' draws: its present values and positions and the options that shape the statistic. */
export function drawSeed(input: VerdictReferenceInput, words: readonly string[]): SeedHash {
  const seed = new SeedHash();
  for (const word of words) seed.word(word);
  const { deviations, present } = input;
  for (let t = 0; t < deviations.length; t++) {
    if (present[t] === 1) seed.number(t).number(deviations[t] as number);
  }
  return seed;
}

/**
 * The levels of the verdict for one series. `seedWords` name the options (kinds, K, alpha) so
 * that different requests on the same data draw differently but each always the same.
 */
export function verdictLevels(
  input: VerdictReferenceInput,
  seedWords: readonly string[],
): SeriesLevels {
  const { spec, alpha, fittedParams, keyLags, innerLevel, q, df } = input;
  if (referenceKind(spec.n, spec.maxLag, fittedParams, alpha) === "permutation") {
    return permutationLevels(input, drawSeed(input, seedWords).stream());
  }
  const tested = testedLags(spec);
  const limit = normalLimit(tested, df, alpha, keyLags, innerLevel);
  const p = chiSquareUpperTail(q, df);
  const bonferroni = Math.min(1, 2 * structureStatistic(q, input.largest, df, tested));
  return {
    reference: "normal-limit",
    draws: NORMAL_LIMIT_DRAWS,
    ...limit,
    jointP: { p, reference: "chi-square", draws: 0, bound: p <= 1e-300 },
    jointRejects: q > limit.criticalQ,
    structureP: {
      p: bonferroni,
      reference: "normal-limit",
      draws: 0,
      bound: bonferroni <= 1e-300,
    },
  };
}

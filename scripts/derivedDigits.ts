/**
 * test/fixtures/derived-values.tsv: the values that test/core/correlogramDerived.test.ts and
 * test/core/sideChecksDerived.test.ts check, each evaluated from its published definition with
 * decimal.js at 110 significant digits (scripts/referenceDigits.ts's `High`) and rounded once to
 * 15 significant digits — never with Echolot's own code or another statistics program. The
 * definition is written beside each value in the file.
 *
 * Inputs: Series F (test/fixtures/series-f.csv, whole numbers, so the data are exact) and small
 * constructed cases (1..5, the runs test's coin sequence, theoretical AR and MA correlations).
 * The χ² upper tail is Q(ν/2, x/2) = 1 − P(ν/2, x/2) with P by its power series (A&S 6.5.29,
 * referenceDigits.ts); the subtraction cancels −log10 Q digits, so a tail is refused below 1e−60,
 * which still leaves 50 digits. Written by `npm run fixtures`; checked byte for byte by
 * test/scripts/referenceDigits.test.ts.
 */
import { High, lowerGammaRatio, significant } from "./referenceDigits";

type HighNumber = InstanceType<typeof High>;

/** Digits kept of each value: more than a double carries, fewer than the evaluation settles. */
export const DERIVED_DIGITS = 15;

/** One derived value: its key in the fixture, the value, and the definition evaluated. */
export interface DerivedValue {
  readonly key: string;
  readonly value: HighNumber;
  readonly definition: string;
}

const sumOf = (values: readonly HighNumber[]): HighNumber =>
  values.reduce((sum, v) => sum.plus(v), new High(0));

/** Q(ν/2, x/2), the χ² upper tail, as 1 − P (A&S 6.5.29 with 26.4.19). */
export function chiSquareTail(x: HighNumber, df: number): HighNumber {
  const q = new High(1).minus(lowerGammaRatio(new High(df).dividedBy(2), x.dividedBy(2)));
  if (q.lt("1e-60")) throw new Error(`chiSquareTail: ${q} is too far out for 1 − P`);
  return q;
}

/** Deviations about the mean, d_t = x_t − x̄. */
function deviations(x: readonly HighNumber[]): HighNumber[] {
  const mean = sumOf(x).dividedBy(x.length);
  return x.map((v) => v.minus(mean));
}

/** Σ_{t≥k} a_t b_{t−k}. */
function lagSum(a: readonly HighNumber[], b: readonly HighNumber[], k: number): HighNumber {
  let s = new High(0);
  for (let t = k; t < a.length; t++) s = s.plus((a[t] as HighNumber).times(b[t - k] as HighNumber));
  return s;
}

/** r_0..r_K, r_k = Σ_{t>k} d_t d_{t−k} / Σ d_t² (the biased estimator; Box, Jenkins & Reinsel). */
export function autocorrelations(x: readonly HighNumber[], maxLag: number): HighNumber[] {
  const d = deviations(x);
  const c0 = lagSum(d, d, 0);
  return Array.from({ length: maxLag + 1 }, (_, k) => lagSum(d, d, k).dividedBy(c0));
}

/** φ_11..φ_KK from ρ_0..ρ_K by the Durbin–Levinson recursion (Levinson 1947; Durbin 1960). */
export function durbinLevinson(rho: readonly HighNumber[]): HighNumber[] {
  const r = (k: number) => rho[k] as HighNumber;
  const partials: HighNumber[] = [];
  let phi: HighNumber[] = [];
  for (let k = 1; k < rho.length; k++) {
    let numerator = r(k);
    let denominator = new High(1);
    for (let j = 1; j < k; j++) {
      numerator = numerator.minus((phi[j - 1] as HighNumber).times(r(k - j)));
      denominator = denominator.minus((phi[j - 1] as HighNumber).times(r(j)));
    }
    const kk = numerator.dividedBy(denominator);
    phi = [...phi.map((p, j) => p.minus(kk.times(phi[k - j - 2] as HighNumber))), kk];
    partials.push(kk);
  }
  return partials;
}

/** Ljung–Box Q(K) = n(n+2) Σ_{k≤K} r_k²/(n−k) (Ljung & Box 1978). */
function ljungBox(r: readonly HighNumber[], n: number, maxLag: number): HighNumber {
  let s = new High(0);
  for (let k = 1; k <= maxLag; k++) s = s.plus((r[k] as HighNumber).pow(2).dividedBy(n - k));
  return s.times(n * (n + 2));
}

/** Solves A x = b by Gaussian elimination with partial pivoting. */
export function solveLinear(
  a: readonly (readonly HighNumber[])[],
  b: readonly HighNumber[],
): HighNumber[] {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i] as HighNumber]);
  const at = (r: number, c: number) => (m[r] as HighNumber[])[c] as HighNumber;
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (at(r, col).abs().gt(at(pivot, col).abs())) pivot = r;
    [m[col], m[pivot]] = [m[pivot] as HighNumber[], m[col] as HighNumber[]];
    for (let r = col + 1; r < n; r++) {
      const factor = at(r, col).dividedBy(at(col, col));
      const row = m[r] as HighNumber[];
      for (let c = col; c <= n; c++) row[c] = at(r, c).minus(factor.times(at(col, c)));
    }
  }
  const x: HighNumber[] = new Array<HighNumber>(n);
  for (let r = n - 1; r >= 0; r--) {
    let s = at(r, n);
    for (let c = r + 1; c < n; c++) s = s.minus(at(r, c).times(x[c] as HighNumber));
    x[r] = s.dividedBy(at(r, r));
  }
  return x;
}

/**
 * Engle's LM = T·R² of s_t on 1, s_{t−1}, …, s_{t−q} over t = q+1..n, s_t = d_t² (Engle 1982),
 * R² = 1 − RSS/TSS about the mean of the regressand; β from the normal equations.
 */
function engleLm(x: readonly HighNumber[], q: number): HighNumber {
  const s = deviations(x).map((d) => d.pow(2));
  const rows: HighNumber[][] = [];
  const y: HighNumber[] = [];
  for (let t = q; t < s.length; t++) {
    rows.push([new High(1), ...Array.from({ length: q }, (_, j) => s[t - j - 1] as HighNumber)]);
    y.push(s[t] as HighNumber);
  }
  const p = q + 1;
  const column = (j: number) => rows.map((row) => row[j] as HighNumber);
  const dot = (u: readonly HighNumber[], v: readonly HighNumber[]) =>
    sumOf(u.map((value, i) => value.times(v[i] as HighNumber)));
  const xtx = Array.from({ length: p }, (_, i) =>
    Array.from({ length: p }, (_, j) => dot(column(i), column(j))),
  );
  const beta = solveLinear(
    xtx,
    Array.from({ length: p }, (_, i) => dot(column(i), y)),
  );
  const ybar = sumOf(y).dividedBy(y.length);
  const fitted = rows.map((row) => dot(row, beta));
  const rss = sumOf(y.map((v, i) => v.minus(fitted[i] as HighNumber).pow(2)));
  const tss = sumOf(y.map((v) => v.minus(ybar).pow(2)));
  return new High(1).minus(rss.dividedBy(tss)).times(y.length);
}

/** The Series F values (lag table, side checks). */
function seriesFValues(data: readonly HighNumber[]): DerivedValue[] {
  const n = data.length;
  const out: DerivedValue[] = [];
  const add = (key: string, value: HighNumber, definition: string) =>
    out.push({ key: `seriesF.${key}`, value, definition });
  const r = autocorrelations(data, 12);
  const d = deviations(data);
  const c0 = lagSum(d, d, 0);

  durbinLevinson(r.slice(0, 7)).forEach((phi, i) =>
    add(`partial.${i + 1}`, phi, "φ_kk by Durbin–Levinson from r_k = Σ d_t d_{t−k} / Σ d_t²"),
  );
  for (let k = 1; k <= 6; k++) {
    const sum = sumOf(r.slice(1, k).map((v) => v.pow(2)));
    add(`bartlettSe.${k}`, sum.times(2).plus(1).dividedBy(n).sqrt(), "√((1 + 2Σ_{j<k} r_j²)/n)");
  }
  const squares = d.map((v) => v.pow(2));
  const robust = Array.from({ length: 5 }, (_, i) =>
    lagSum(squares, squares, i + 1).dividedBy(c0.pow(2)),
  );
  robust.forEach((v, i) =>
    add(`robustNv.${i + 1}`, v.times(n), "n·v̂_k, v̂_k = Σ d_t² d_{t−k}² / c0²"),
  );
  const robustQ = sumOf(robust.map((v, i) => (r[i + 1] as HighNumber).pow(2).dividedBy(v)));
  add("robustQ.5", robustQ, "Q* = Σ_{k≤5} r_k²/v̂_k");
  add("robustP.5", chiSquareTail(robustQ, 5), "Q(5/2, Q*/2), χ²_5 upper tail");
  for (const k of [1, 5, 10, 12]) {
    const q = ljungBox(r, n, k);
    add(`ljungBoxQ.${k}`, q, "n(n+2) Σ_{j≤k} r_j²/(n−j)");
    add(`ljungBoxP.${k}`, chiSquareTail(q, k), "χ²_k upper tail of Ljung–Box Q(k)");
  }
  const boxPierce = sumOf(r.slice(1, 11).map((v) => v.pow(2))).times(n);
  add("boxPierceQ.10", boxPierce, "n Σ_{k≤10} r_k²");
  add("boxPierceP.10", chiSquareTail(boxPierce, 10), "χ²_10 upper tail of Box–Pierce Q(10)");
  const squareR = autocorrelations(squares, 5);
  const mcleodLi = ljungBox(squareR, n, 5);
  add("mcleodLiQ.5", mcleodLi, "Ljung–Box Q(5) of s_t = d_t², r_k of s about its mean");
  add("mcleodLiP.5", chiSquareTail(mcleodLi, 5), "χ²_5 upper tail of McLeod–Li Q(5)");
  for (const q of [1, 2, 4]) {
    const lm = engleLm(data, q);
    add(`engleLm.${q}`, lm, "T·R² of s_t on 1, s_{t−1..t−q}, T = n − q, s_t = d_t²");
    add(`engleP.${q}`, chiSquareTail(lm, q), "χ²_q upper tail of Engle's LM");
  }
  const gamma = (j: number) => lagSum(d, d, j).dividedBy(n);
  const weighted = sumOf([1, 2, 3].map((j) => gamma(j).times(1 - j / 4)));
  const lrv = gamma(0).plus(weighted.times(2));
  add("neweyWestLrv.3", lrv, "γ̂_0 + 2Σ_{j≤3} (1 − j/4) γ̂_j, γ̂_j = Σ d_t d_{t−j}/n");
  add("neweyWestSe.3", lrv.dividedBy(n).sqrt(), "√(LRV/n)");
  const moment = (j: number) => sumOf(d.map((v) => v.pow(j))).dividedBy(n);
  const skewness = moment(3).dividedBy(moment(2).pow("1.5"));
  const kurtosis = moment(4).dividedBy(moment(2).pow(2));
  add("skewness", skewness, "m₃/m₂^{3/2}, m_j = Σ d^j/n");
  add("kurtosis", kurtosis, "m₄/m₂²");
  add("jarqueBera", jarqueBera(skewness, kurtosis, n), "(n/6)(S² + (K − 3)²/4)");
  return out;
}

function jarqueBera(skewness: HighNumber, kurtosis: HighNumber, n: number): HighNumber {
  return skewness.pow(2).plus(kurtosis.minus(3).pow(2).dividedBy(4)).times(n).dividedBy(6);
}

/** Constructed cases whose definitions need no data file. */
function constructedValues(): DerivedValue[] {
  const out: DerivedValue[] = [];
  const add = (key: string, value: HighNumber, definition: string) =>
    out.push({ key, value, definition });
  // 1..5: S = 0, K = m₄/m₂² = (34/5)/(2²) = 1.7.
  add(
    "oneToFive.jarqueBera",
    jarqueBera(new High(0), new High("1.7"), 5),
    "(n/6)(S² + (K − 3)²/4)",
  );

  // The coin sequence HHTTHTHHHHTHHTTTTTHH: 9 runs, 11 heads, 9 tails (Wald & Wolfowitz 1940).
  const [n1, n2, runs] = [11, 9, 9];
  const product = new High(2 * n1 * n2);
  const total = n1 + n2;
  const expected = product.dividedBy(total).plus(1);
  const sd = product
    .times(product.minus(total))
    .dividedBy(total * total * (total - 1))
    .sqrt();
  add("coin.runsSd", sd, "√(2n₁n₂(2n₁n₂ − n)/(n²(n − 1)))");
  add("coin.runsZ", new High(runs).minus(expected).dividedBy(sd), "(R − (2n₁n₂/n + 1))/s_R");

  // Σ_{j≥m} C(K, j) α^j (1 − α)^{K−j}, α = 0.05.
  const alpha = new High("0.05");
  const binomial: readonly (readonly [number, number])[] = [
    [1, 10],
    [2, 10],
    [2, 20],
    [3, 20],
    [2, 24],
    [2, 40],
    [4, 40],
  ];
  for (const [m, trials] of binomial) {
    let tail = new High(0);
    let choose = new High(1);
    for (let j = 0; j <= trials; j++) {
      if (j > 0) choose = choose.times(trials - j + 1).dividedBy(j);
      if (j >= m)
        tail = tail.plus(
          choose.times(alpha.pow(j)).times(new High(1).minus(alpha).pow(trials - j)),
        );
    }
    add(`binomialTail.${m}.${trials}`, tail, "Σ_{j≥m} C(K,j) α^j (1−α)^{K−j}, α = 0.05");
  }

  add("chiSquareTail.50.10", chiSquareTail(new High(50), 10), "Q(5, 25)");
  add("chiSquareTail.200.20", chiSquareTail(new High(200), 20), "Q(10, 100)");
  const normalTail = new High(1).minus(lowerGammaRatio(new High("0.5"), new High(32))).dividedBy(2);
  add("normalTail.8", normalTail, "Φᶜ(8) = ½(1 − P(½, 32)) = ½ erfc(8/√2)");

  // MA(1), θ = 0.5: ρ_1 = θ/(1 + θ²) = 0.4, 0 beyond (Box, Jenkins & Reinsel, ch. 3).
  const ma1 = [new High(1), new High("0.4"), new High(0), new High(0), new High(0)];
  durbinLevinson(ma1).forEach((phi, i) =>
    add(`ma1.partial.${i + 1}`, phi, "φ_kk by Durbin–Levinson, ρ = (1, 0.4, 0, 0, 0)"),
  );
  // AR(2) (0.5, 0.3): ρ_1 = φ1/(1 − φ2), ρ_k = φ1ρ_{k−1} + φ2ρ_{k−2} (Yule–Walker).
  const rho = [new High(1), new High("0.5").dividedBy("0.7")];
  for (let k = 2; k <= 3; k++) {
    rho.push((rho[k - 1] as HighNumber).times("0.5").plus((rho[k - 2] as HighNumber).times("0.3")));
  }
  rho.slice(1).forEach((value, i) => add(`ar2.rho.${i + 1}`, value, "Yule–Walker, φ = (0.5, 0.3)"));
  return out;
}

/** Every derived value, Series F's first. */
export function derivedValues(seriesF: readonly bigint[]): DerivedValue[] {
  const data = seriesF.map((v) => new High(v.toString()));
  return [...seriesFValues(data), ...constructedValues()];
}

const HEADER =
  "# Values derived from published definitions, each evaluated with decimal.js at 110 " +
  "significant digits and rounded once to 15 (half-even); the definition is beside each. " +
  "Written by scripts/generate-fixture-digits.ts (npm run fixtures) from scripts/derivedDigits.ts; " +
  "seriesF.* from series-f.csv (n = 70, d_t = x_t − x̄, c0 = Σ d_t²).";

/** derived-values.tsv as text. */
export function derivedTable(seriesF: readonly bigint[]): string {
  const lines = [HEADER, "key\tvalue_15sig\tdefinition"];
  for (const { key, value, definition } of derivedValues(seriesF)) {
    lines.push(`${key}\t${significant(value, DERIVED_DIGITS)}\t${definition}`);
  }
  return `${lines.join("\n")}\n`;
}

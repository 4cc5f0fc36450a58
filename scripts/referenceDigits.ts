/**
 * The high-precision columns of the test fixtures, evaluated from their published definitions
 * with decimal.js (a general-purpose arbitrary-precision library) — never with Echolot's own code
 * or another statistics program:
 *
 * - chisq-table.tsv `ours_30sig`: the χ² critical value x with upper tail Q(df/2, x/2) = p;
 * - normal-quantiles.tsv `ours_50sig`: the standard normal quantile z with Φ(z) = p, where
 *   Φ(z) = ½ + ½·P(½, z²/2) for z ≥ 0 (Abramowitz & Stegun 26.2.29 with 6.5.1);
 * - lew-acf-ehandbook.tsv `exact_r_k`: r_k = Σ_{t>k} d_t d_{t−k} / Σ_t d_t² of strd/Lew.dat,
 *   evaluated as an exact rational (integer data, d_t = n·x_t − Σx) and rounded once;
 * - each file's agreement column (`printed_ok`, `matches_rounding`): the printed digits against
 *   ours, as the file's header states.
 *
 * P(a, y) is the regularised lower incomplete gamma by its power series
 * P(a, y) = y^a e^{−y} / Γ(a+1) · Σ_{j≥0} y^j / ((a+1)(a+2)…(a+j)) (Abramowitz & Stegun 6.5.29),
 * summed until a term falls below 10^−(digits+5) of the sum; Γ(a+1) is exact for the whole and
 * half-whole a that occur (A&S 6.1.12). The quantile is found by Newton's method on that series
 * (its derivative is the density), kept inside a bracket that bisection shrinks whenever a Newton
 * step would leave it, at 110 significant digits, until the step is below 10^−100 of the root.
 * scripts/generate-fixture-digits.ts writes the columns; test/scripts/referenceDigits.test.ts
 * checks that the committed files are what this module computes.
 */
import Decimal from "decimal.js";

/** 110 significant digits: the 50 kept digits are then settled with room to spare. */
export const High = Decimal.clone({ precision: 110, rounding: Decimal.ROUND_HALF_EVEN });
type HighNumber = InstanceType<typeof High>;

const STEP_TOLERANCE = new High("1e-100");

/** Γ(a + 1) for a whole or half-whole a ≥ 0 (A&S 6.1.12: Γ(n + ½) = (2n)! √π / (4ⁿ n!)). */
function gammaOfNext(a: HighNumber): HighNumber {
  const twice = a.times(2);
  if (!twice.isInteger()) throw new Error(`gammaOfNext: ${a} is not a multiple of 1/2`);
  if (a.isInteger()) {
    let product = new High(1);
    for (let k = 2; a.gte(k); k++) product = product.times(k);
    return product;
  }
  // a = m + ½: Γ(a + 1) = (a)(a − 1)…(½)·Γ(½), Γ(½) = √π.
  let product = High.acos(-1).sqrt();
  for (let factor = a; factor.gt(0); factor = factor.minus(1)) product = product.times(factor);
  return product;
}

/** P(a, y), the regularised lower incomplete gamma, by its power series (A&S 6.5.29). */
export function lowerGammaRatio(a: HighNumber, y: HighNumber): HighNumber {
  if (y.isZero()) return new High(0);
  const negligible = new High(10).pow(-(High.precision + 5));
  let term = new High(1);
  let sum = new High(1);
  for (let j = 1; ; j++) {
    term = term.times(y).dividedBy(a.plus(j));
    sum = sum.plus(term);
    if (term.lt(sum.times(negligible))) break;
  }
  return y.pow(a).times(y.negated().exp()).dividedBy(gammaOfNext(a)).times(sum);
}

/**
 * The root of an increasing `cdf` at `target` inside [low, high], by Newton's method with the
 * `density` as derivative, falling back to bisection whenever a step leaves the bracket.
 */
function increasingRoot(
  cdf: (x: HighNumber) => HighNumber,
  density: (x: HighNumber) => HighNumber,
  target: HighNumber,
  bracket: readonly [HighNumber, HighNumber],
): HighNumber {
  let [low, high] = bracket;
  let x = low.plus(high).dividedBy(2);
  for (let iteration = 0; iteration < 2000; iteration++) {
    const gap = cdf(x).minus(target);
    if (gap.isZero()) return x;
    if (gap.isNegative()) low = x;
    else high = x;
    const newton = x.minus(gap.dividedBy(density(x)));
    const next = newton.gt(low) && newton.lt(high) ? newton : low.plus(high).dividedBy(2);
    const step = next.minus(x).abs();
    x = next;
    if (step.lte(x.abs().times(STEP_TOLERANCE))) return x;
  }
  throw new Error(`increasingRoot: no convergence for target ${target}`);
}

/** The χ² critical value with upper-tail probability `upperTail` at `df` degrees of freedom. */
export function chiSquareCritical(df: number, upperTail: string): HighNumber {
  const a = new High(df).dividedBy(2);
  const logNorm = gammaOfNext(a).dividedBy(a).times(new High(2).pow(a)).ln();
  const cdf = (x: HighNumber) => lowerGammaRatio(a, x.dividedBy(2));
  // f(x) = x^{a−1} e^{−x/2} / (2^a Γ(a)).
  const density = (x: HighNumber) =>
    a.minus(1).times(x.ln()).minus(x.dividedBy(2)).minus(logNorm).exp();
  const target = new High(1).minus(upperTail);
  return increasingRoot(cdf, density, target, [new High("1e-30"), new High(40 * df + 100)]);
}

/** The standard normal quantile z_p for p > ½. */
export function normalQuantileAbove(p: string): HighNumber {
  const half = new High("0.5");
  if (!new High(p).gt(half)) throw new Error(`normalQuantileAbove: p ${p} is not above 1/2`);
  const root2pi = High.acos(-1).times(2).sqrt();
  const cdf = (z: HighNumber) =>
    half.plus(half.times(lowerGammaRatio(half, z.times(z).dividedBy(2))));
  const density = (z: HighNumber) => z.times(z).dividedBy(-2).exp().dividedBy(root2pi);
  return increasingRoot(cdf, density, new High(p), [new High(0), new High(40)]);
}

/** r_0..r_maxLag of integer data as exact rationals, each rounded once to `digits` digits. */
export function exactAutocorrelationsOfIntegers(
  data: readonly bigint[],
  maxLag: number,
  digits: number,
): string[] {
  const n = BigInt(data.length);
  const total = data.reduce((sum, x) => sum + x, 0n);
  // n·(x_t − mean): whole numbers, so every lag sum is exact.
  const d = data.map((x) => n * x - total);
  const lagSum = (k: number): bigint => {
    let s = 0n;
    for (let t = k; t < d.length; t++) s += (d[t] as bigint) * (d[t - k] as bigint);
    return s;
  };
  const c0 = lagSum(0);
  const r: string[] = [];
  for (let k = 0; k <= maxLag; k++) {
    // A quotient to 110 digits, rounded once to `digits`: exact to that many digits.
    const ratio = new High(lagSum(k).toString()).dividedBy(c0.toString());
    r.push(significant(ratio, digits));
  }
  return r;
}

/** `value` rounded half-even to `digits` significant digits, in plain notation. */
export function significant(value: HighNumber, digits: number): string {
  const rounded = value.toSignificantDigits(digits, Decimal.ROUND_HALF_EVEN);
  return rounded.isInteger() ? rounded.toFixed(0) : rounded.toPrecision(digits);
}

/** `value` cut (not rounded) to `decimals` places, in plain notation. */
function truncated(value: HighNumber, decimals: number): string {
  return value.toDecimalPlaces(decimals, Decimal.ROUND_DOWN).toFixed(decimals);
}

function rounded(value: HighNumber, decimals: number): string {
  return value.toFixed(decimals, Decimal.ROUND_HALF_EVEN);
}

function decimalsOf(printed: string): number {
  return printed.split(".")[1]?.length ?? 0;
}

/** A fixture: its `#` header lines, its column names and its rows, all as text. */
interface Table {
  readonly comments: string[];
  readonly columns: string[];
  readonly rows: string[][];
}

function parseTable(text: string): Table {
  const lines = text.split("\n");
  if (lines.at(-1) === "") lines.pop();
  const comments = lines.filter((line) => line.startsWith("#"));
  const [header, ...data] = lines.filter((line) => !line.startsWith("#"));
  if (header === undefined) throw new Error("the fixture has no header row");
  return { comments, columns: header.split("\t"), rows: data.map((line) => line.split("\t")) };
}

function formatTable(table: Table): string {
  const lines = [
    ...table.comments,
    table.columns.join("\t"),
    ...table.rows.map((r) => r.join("\t")),
  ];
  return `${lines.join("\n")}\n`;
}

/** Rewrites the columns named in `compute` for every row; other cells stay as they are. */
function rewriteColumns(
  text: string,
  compute: (cell: (name: string) => string) => Record<string, string>,
): string {
  const table = parseTable(text);
  const index = (name: string): number => {
    const at = table.columns.indexOf(name);
    if (at < 0) throw new Error(`the fixture has no column ${name}`);
    return at;
  };
  const rows = table.rows.map((row) => {
    const cell = (name: string) => row[index(name)] ?? "";
    const next = [...row];
    for (const [name, value] of Object.entries(compute(cell))) next[index(name)] = value;
    return next;
  });
  return formatTable({ ...table, rows });
}

/** chisq-table.tsv with `ours_30sig` and `printed_ok` computed. */
export function chiSquareTable(text: string): string {
  return rewriteColumns(text, (cell) => {
    const ours = chiSquareCritical(Number(cell("df")), cell("upper_tail_prob"));
    const agree = ["printed_3dp", "printed_4dp"].every(
      (column) => rounded(ours, decimalsOf(cell(column))) === cell(column),
    );
    return { ours_30sig: significant(ours, 30), printed_ok: agree ? "yes" : "no" };
  });
}

/** normal-quantiles.tsv with `ours_50sig` and `printed_ok` computed. */
export function normalQuantileTable(text: string): string {
  return rewriteColumns(text, (cell) => {
    const ours = normalQuantileAbove(cell("p"));
    const printed = cell("printed");
    // Digit strings are cut after their last digit or rounded there (the 90-decimal OEIS string
    // of z_0.995 ends …657 where the expansion runs …6569936…); 4-decimal tables round.
    const places = decimalsOf(printed);
    const agree = truncated(ours, places) === printed || rounded(ours, places) === printed;
    return { ours_50sig: significant(ours, 50), printed_ok: agree ? "yes" : "no" };
  });
}

/** lew-acf-ehandbook.tsv with `exact_r_k` and `matches_rounding` computed from Lew.dat's data. */
export function lewTable(text: string, lewData: readonly bigint[]): string {
  const rowCount = parseTable(text).rows.length;
  const exact = exactAutocorrelationsOfIntegers(lewData, rowCount - 1, 20);
  return rewriteColumns(text, (cell) => {
    const value = exact[Number(cell("lag"))];
    if (value === undefined) throw new Error(`no lag ${cell("lag")} in Lew.dat's range`);
    // The printed table shows −0.0006 as 0.00.
    const shown = rounded(new High(value), 2).replace(/^-(0\.0+)$/, "$1");
    return { exact_r_k: value, matches_rounding: shown === cell("printed_2dp") ? "yes" : "no" };
  });
}

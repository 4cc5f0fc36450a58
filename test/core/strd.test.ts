/**
 * NIST StRD univariate datasets (itl.nist.gov/div898/strd/univ/, certified values printed in each
 * file's header; see test/fixtures/README.md): mean, sample standard deviation (n − 1, as NIST
 * certifies it) and lag-1 autocorrelation, scored by the log relative error.
 *
 * The certified values assume exact decimal inputs; a spreadsheet hands over doubles. So each
 * statistic is also evaluated exactly (decimal.js, 60 digits) on the double-rounded inputs, which
 * gives two more scores: the computation against that exact value (the algorithm's own loss) and
 * the exact value against the certified one (the best any double computation can reach, "limit").
 */
import { mkdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { centre, lagTable, seriesFromNumbers } from "../../src/core";
import { exactOfDouble, exactStatistics, logRelativeError } from "../helpers/exact";
import { expectAtLeast } from "../helpers/expectClose";
import { FIXTURES, readStrd, readStrdCertified } from "../helpers/fixtures";

/**
 * Required LRE per file (issue 2): within 0.5 digit of what the exact value of the double-rounded
 * inputs allows. Where the doubles themselves cannot reach the listed figure (the sd of NumAcc3
 * and NumAcc4, whose inputs 1000000.1 and 10000000.1 carry representation errors of ~1e-10 and
 * ~1e-9 against a spread of 0.1), the requirement is the doubles' limit minus 0.5; the
 * computation must in any case match the exact value of the doubles to the listed figure.
 */
const REQUIRED: Readonly<Record<string, number>> = {
  PiDigits: 14,
  Lottery: 14,
  Lew: 14,
  NumAcc1: 14,
  NumAcc2: 14,
  Mavro: 13,
  Michelso: 12.9,
  NumAcc3: 11.5,
  NumAcc4: 10.5,
};

interface LreRow {
  readonly dataset: string;
  readonly statistic: string;
  readonly certified: string;
  readonly computed: number;
  readonly vsCertified: number;
  readonly vsExact: number;
  readonly limit: number;
  readonly required: number;
}

const table: LreRow[] = [];

function markdownTable(rows: readonly LreRow[]): string {
  const lines = [
    "| dataset | statistic | certified | computed (double) | LRE vs certified | LRE vs exact of doubles | limit of doubles | required |",
    "| --- | --- | ---: | ---: | ---: | ---: | ---: | ---: |",
  ];
  for (const row of rows) {
    lines.push(
      `| ${row.dataset} | ${row.statistic} | ${row.certified} | ${row.computed} | ${row.vsCertified.toFixed(2)} | ${row.vsExact.toFixed(2)} | ${row.limit.toFixed(2)} | ${row.required.toFixed(2)} |`,
    );
  }
  return lines.join("\n");
}

describe("NIST StRD univariate: lagTable(series) mean and r1, centre(series) c0 → sd", () => {
  const certified = readStrdCertified();

  it("reads all nine certified datasets with the printed number of observations", () => {
    // Source: NIST StRD univariate files, header "Number of Observations".
    expect(certified.map((c) => c.dataset).sort()).toEqual(Object.keys(REQUIRED).sort());
    for (const c of certified) expect(readStrd(c.dataset).length, c.dataset).toBe(c.n);
  });

  it.each(certified.map((c) => [c.dataset, c] as const))(
    "lagTable(%s) reaches the required log relative error on mean, sd and r1",
    (dataset, cert) => {
      // Source: NIST StRD certified values (file header lines 41–43), 15 significant digits.
      const x = readStrd(dataset);
      const series = seriesFromNumbers(x, dataset);
      const result = lagTable(series, { maxLag: 1 });
      const { n, sumSquares } = centre(series);
      const computed = {
        mean: result.mean,
        sd: Math.sqrt(sumSquares / (n - 1)),
        r1: result.rows[0]?.correlation ?? NaN,
      };
      // Exact statistics of the double-rounded inputs, decimal.js at 60 digits, from the
      // published definitions (NIST StRD certification method).
      const exact = exactStatistics(Array.from(x, exactOfDouble));
      const required = REQUIRED[dataset] as number;
      for (const statistic of ["mean", "sd", "r1"] as const) {
        const vsCertified = logRelativeError(computed[statistic], cert[statistic]);
        const vsExact = logRelativeError(computed[statistic], exact[statistic]);
        const limit = logRelativeError(exact[statistic], cert[statistic]);
        // Within 0.5 digit of what the doubles allow, and at least the listed figure unless the
        // doubles themselves fall short of it.
        const floor = limit < required ? limit - 0.5 : Math.max(required, limit - 0.5);
        table.push({
          dataset,
          statistic,
          certified: cert[statistic],
          computed: computed[statistic],
          vsCertified,
          vsExact,
          limit,
          required: floor,
        });
        expectAtLeast(
          vsCertified,
          floor,
          `${dataset} ${statistic}: computed ${computed[statistic]} vs certified ${cert[statistic]} (LRE; limit of the doubles ${limit.toFixed(2)})`,
        );
        expectAtLeast(
          vsExact,
          required,
          `${dataset} ${statistic}: computed ${computed[statistic]} vs exact of the doubles ${exact[statistic].toSignificantDigits(20).toString()} (LRE)`,
        );
      }
    },
  );

  afterAll(() => {
    if (table.length === 0) return;
    const order = Object.keys(REQUIRED);
    const sorted = [...table].sort((a, b) => order.indexOf(a.dataset) - order.indexOf(b.dataset));
    const markdown = markdownTable(sorted);
    console.log(`NIST StRD log relative errors (capped at 15):\n${markdown}`);
    const outputDirectory = join(FIXTURES, "..", "..", "test-output");
    mkdirSync(outputDirectory, { recursive: true });
    writeFileSync(
      join(outputDirectory, "lre-table.md"),
      `# NIST StRD log relative errors\n\nWritten by test/core/strd.test.ts. LRE = −log10(|computed − reference| / |reference|), capped at 15.\n"limit of doubles" is the LRE of the exact statistic of the double-rounded inputs against the certified value.\n\n${markdown}\n`,
    );
  });
});

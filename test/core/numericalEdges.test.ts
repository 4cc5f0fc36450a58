/**
 * Numerical edges found by a 50-digit audit, each against the published definitions evaluated in
 * 60-digit decimal.js arithmetic (test/helpers/exact.ts) or against the same data at ordinary
 * scale: a level a few units in the last place wide, data near 1e155, 1e-160, 1e-200 and 1e307,
 * and a runs test with one value on each side of its median.
 */
import { describe, expect, it } from "vitest";
import {
  biasCheck,
  forecastAudit,
  isEcholotError,
  lagTable,
  runsCheck,
  seriesFromNumbers,
} from "../../src/core";
import { seededRandom } from "../../src/sim/random";
import { exactAutocorrelations, exactOfDouble } from "../helpers/exact";
import { expectClose } from "../helpers/expectClose";

function noise(seed: number, n: number): number[] {
  const random = seededRandom(seed);
  return Array.from({ length: n }, () => random.normal());
}

describe("centring data a few units in the last place apart", () => {
  it("lagTable(200 values in {1, 1 + 2⁻⁵²}) gives the exact r_k of those doubles to 1e-14", () => {
    const random = seededRandom(52);
    const x = Array.from({ length: 200 }, () => (random.uniform() < 0.5 ? 1 : 1 + 2 ** -52));
    const table = lagTable(seriesFromNumbers(x), { maxLag: 10 });
    const exact = exactAutocorrelations(x.map(exactOfDouble), 10);
    for (let k = 1; k <= 10; k++) {
      expectClose(
        table.rows[k - 1]?.correlation ?? NaN,
        (exact[k] as { toNumber(): number }).toNumber(),
        { abs: 1e-14 },
        `r_${k} of 200 values in {1, 1 + 2^-52}`,
      );
    }
  });

  it("lagTable(1e9 + 1e-5·noise) gives the exact r_k of those doubles to 1e-12", () => {
    const x = noise(9, 150).map((e) => 1e9 + 1e-5 * e);
    const table = lagTable(seriesFromNumbers(x), { maxLag: 5 });
    const exact = exactAutocorrelations(x.map(exactOfDouble), 5);
    for (let k = 1; k <= 5; k++) {
      expectClose(
        table.rows[k - 1]?.correlation ?? NaN,
        (exact[k] as { toNumber(): number }).toNumber(),
        { abs: 1e-12 },
        `r_${k} of 1e9 + 1e-5·noise`,
      );
    }
  });
});

describe("extreme magnitudes", () => {
  const base = noise(155, 120).map((e) => e + 0.3);
  const ordinary = biasCheck(seriesFromNumbers(base));
  for (const factor of [1e155, 1e-160, 1e-200]) {
    it(`biasCheck(data × ${factor}) gives the t of the same data at ordinary scale`, () => {
      // Scale invariance of t = x̄/se: the same data times a power of ten (common practice (no
      // source) for scale-free statistics).
      const scaled = biasCheck(seriesFromNumbers(base.map((v) => v * factor)));
      expectClose(scaled.t, ordinary.t, { rel: 1e-12 }, `t at scale ${factor}`);
      expectClose(scaled.p, ordinary.p, { rel: 1e-9 }, `p at scale ${factor}`);
      expectClose(scaled.se / factor, ordinary.se, { rel: 1e-12 }, `se at scale ${factor}`);
    });
  }

  it("lagTable(values near 1e307) is not refused and gives the correlations of the same data scaled down", () => {
    const small = noise(307, 80).map((e) => 1 + 0.1 * e);
    const huge = lagTable(seriesFromNumbers(small.map((v) => v * 1e307)), { maxLag: 5 });
    const plain = lagTable(seriesFromNumbers(small), { maxLag: 5 });
    for (let k = 1; k <= 5; k++) {
      expectClose(
        huge.rows[k - 1]?.correlation ?? NaN,
        plain.rows[k - 1]?.correlation ?? NaN,
        { rel: 1e-12 },
        `r_${k} near 1e307`,
      );
    }
  });
});

describe("runsCheck with one value on each side of the median", () => {
  it("runsCheck([1, 2, 2, 2, 3]) is refused as too short, with a reason", () => {
    // 1 below and 1 above the median 2: the runs statistic cannot vary (Wald & Wolfowitz 1940).
    let error: unknown;
    try {
      runsCheck(seriesFromNumbers([1, 2, 2, 2, 3]));
    } catch (caught) {
      error = caught;
    }
    expect(isEcholotError(error) && error.kind === "short").toBe(true);
    expect(String((error as Error).message)).toMatch(/at least 3 values off the median/);
  });
});

describe("forecastAudit on long series", () => {
  it("forecastAudit(300,000 MA(2) errors, horizon 3) refers to the normal limit, at a common level within (α/3, α]", () => {
    // Drawing 998 series of 300,000 values would take minutes; the asymptotic reference is used.
    const random = seededRandom(300);
    const x = Array.from({ length: 300_000 }, () => random.normal());
    for (let t = x.length - 1; t >= 2; t--) {
      x[t] = (x[t] as number) + 0.5 * (x[t - 1] as number) + 0.25 * (x[t - 2] as number);
    }
    const audit = forecastAudit(seriesFromNumbers(x), { horizon: 3 });
    expect(audit.levels.reference).toBe("normal-limit");
    expect(audit.levels.jointP.reference).toBe("chi-square");
    expect(audit.levels.structureLevel).toBeGreaterThan(0.05 / 3);
    expect(audit.levels.structureLevel).toBeLessThanOrEqual(0.05);
  }, 120_000);
});

/**
 * The transform path (src/core/fft.ts) against its definitions and against the direct path:
 * the DFT evaluated term by term in 40-digit arithmetic, the lag sums Σ_t a_t a_{t−k} on random
 * data with gaps, the pair counts from the presence mask, and the choice between the paths.
 */
import Decimal from "decimal.js";
import { describe, expect, it } from "vitest";
import {
  autocorrelation,
  centre,
  directLagProductSums,
  fftCrossover,
  lagProductSums,
  lagSumCosts,
  pairCounts,
  prefersFft,
  type Series,
} from "../../src/core";
import { fft, fftBlockSize, fftLagProductSums, nextPowerOfTwo } from "../../src/core/fft";
import { seededRandom, type Random } from "../../src/sim/random";
import { expectAtMost } from "../helpers/expectClose";

const Exact = Decimal.clone({ precision: 40 });

/** A series of `length` positions, offset + noise, with interior gaps at rate `gapRate`. */
function gappySeries(random: Random, length: number, gapRate: number, offset = 0): Series {
  const values = new Float64Array(length);
  const present = new Uint8Array(length);
  let count = 0;
  for (let t = 0; t < length; t++) {
    const interior = t > 0 && t < length - 1;
    if (interior && random.uniform() < gapRate) {
      values[t] = NaN;
    } else {
      values[t] = offset + random.normal();
      present[t] = 1;
      count++;
    }
  }
  return { values, present, label: "", count, gaps: length - count };
}

/** max_k |a_k − b_k| / |b_0|: the error relative to the largest lag sum (s_0 ≥ |s_k|). */
function normwiseError(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let worst = 0;
  for (let k = 0; k < b.length; k++) {
    worst = Math.max(worst, Math.abs((a[k] as number) - (b[k] as number)));
  }
  return worst / Math.abs(b[0] as number);
}

describe("fft(re, im) against the DFT definition", () => {
  it("fft(x) equals X_f = Σ_t x_t e^{−2πi ft/N} evaluated in 40 digits, N = 64, to 1e-14 of max|X|", () => {
    // Source: the DFT definition (Cooley & Tukey 1965, Math. Comp. 19:297–301, eq. 1),
    // evaluated term by term with decimal.js.
    const random = seededRandom(641);
    const size = 64;
    const re = new Float64Array(size);
    const im = new Float64Array(size);
    for (let t = 0; t < size; t++) {
      re[t] = random.normal();
      im[t] = random.normal();
    }
    const exactRe: number[] = [];
    const exactIm: number[] = [];
    const twoPi = Exact.acos(-1).times(2);
    for (let f = 0; f < size; f++) {
      let sr = new Exact(0);
      let si = new Exact(0);
      for (let t = 0; t < size; t++) {
        const angle = twoPi.times((f * t) % size).dividedBy(size);
        const c = Exact.cos(angle);
        const s = Exact.sin(angle);
        // (x + iy)(cos − i sin) = x cos + y sin + i(y cos − x sin)
        sr = sr.plus(c.times(re[t] as number)).plus(s.times(im[t] as number));
        si = si.plus(c.times(im[t] as number)).minus(s.times(re[t] as number));
      }
      exactRe.push(sr.toNumber());
      exactIm.push(si.toNumber());
    }
    fft(re, im);
    let scale = 0;
    let worst = 0;
    for (let f = 0; f < size; f++) {
      scale = Math.max(scale, Math.hypot(exactRe[f] as number, exactIm[f] as number));
      worst = Math.max(
        worst,
        Math.hypot(
          (re[f] as number) - (exactRe[f] as number),
          (im[f] as number) - (exactIm[f] as number),
        ),
      );
    }
    expectAtMost(worst / scale, 1e-14, "fft vs 40-digit DFT, N 64, max error / max |X|");
  });

  it("fft(x, inverse) after fft(x) gives N·x back to 1e-15 relative, N = 1 … 2^12", () => {
    // Source: the DFT inversion formula, x_t = (1/N) Σ_f X_f e^{+2πi ft/N}.
    const random = seededRandom(4096);
    for (let size = 1; size <= 4096; size *= 2) {
      const re = new Float64Array(size);
      const im = new Float64Array(size);
      for (let t = 0; t < size; t++) {
        re[t] = random.normal();
        im[t] = random.normal();
      }
      const original = [Float64Array.from(re), Float64Array.from(im)] as const;
      fft(re, im);
      fft(re, im, true);
      let worst = 0;
      let scale = 0;
      for (let t = 0; t < size; t++) {
        scale = Math.max(
          scale,
          Math.abs(original[0][t] as number),
          Math.abs(original[1][t] as number),
        );
        worst = Math.max(
          worst,
          Math.abs((re[t] as number) / size - (original[0][t] as number)),
          Math.abs((im[t] as number) / size - (original[1][t] as number)),
        );
      }
      expectAtMost(worst / scale, 1e-15 * Math.max(1, Math.log2(size)), `round trip, N ${size}`);
    }
  });

  it("fft(re, im) refuses lengths that are not a power of two, or unequal arrays", () => {
    expect(() => fft(new Float64Array(6), new Float64Array(6))).toThrow(/power-of-two/);
    expect(() => fft(new Float64Array(8), new Float64Array(4))).toThrow(/power-of-two/);
    expect(() => fft(new Float64Array(0), new Float64Array(0))).toThrow(/power-of-two/);
  });

  it("nextPowerOfTwo and fftBlockSize: N ≥ 4(K+1), never longer than one block for the whole series", () => {
    expect([1, 2, 3, 5, 1024, 1025].map(nextPowerOfTwo)).toEqual([1, 2, 4, 8, 1024, 2048]);
    expect(fftBlockSize(1_048_576, 1000)).toBe(4096);
    expect(fftBlockSize(1_048_576, 40)).toBe(256);
    expect(fftBlockSize(100, 90)).toBe(256); // one block: 100 + 90 ≤ 256 < 4·91
  });
});

describe("fftLagProductSums(a, K) equals the direct path on random data with gaps", () => {
  // Tolerance: 1e-12 relative to s_0 = c₀ (the largest lag sum; |s_k| ≤ s_0 by Cauchy–Schwarz),
  // i.e. 1e-12 on the autocorrelation scale. Common practice (no source) for comparing a
  // transform-based correlation with a direct one; the errors seen are about 1e-15.
  const cases: [length: number, maxLag: number, gapRate: number, offset: number][] = [
    [2, 1, 0, 0],
    [7, 6, 0.2, 0],
    [100, 90, 0.3, 0],
    [257, 40, 0.1, 5],
    [1000, 999, 0.25, 0],
    [4099, 100, 0.05, 0],
    [20_000, 250, 0.3, -3],
    [70_001, 1000, 0.02, 0],
  ];

  it.each(cases)(
    "length %i, K %i, gap rate %f, offset %f: values and mask",
    (length, maxLag, gapRate, offset) => {
      const random = seededRandom(length * 31 + maxLag);
      const series = gappySeries(random, length, gapRate, offset);
      const { deviations } = centre(series);
      const direct = directLagProductSums(deviations, maxLag);
      const viaFft = fftLagProductSums(deviations, maxLag);
      expectAtMost(
        normwiseError(viaFft, direct),
        1e-12,
        `lag sums, length ${length}, K ${maxLag}, gaps ${series.gaps}: max|fft − direct| / s_0`,
      );
      // Pair counts: the transform of the presence mask, rounded, is the exact count.
      const counts = fftLagProductSums(series.present, maxLag);
      const exactCounts = bruteForcePairs(series.present, maxLag);
      for (let k = 0; k <= maxLag; k++) {
        const got = counts[k] as number;
        expectAtMost(
          Math.abs(got - (exactCounts[k] as number)),
          1e-6,
          `pairs at lag ${k}, length ${length}: fft ${got} vs count ${exactCounts[k]}`,
        );
      }
    },
  );

  it("autocorrelation(series, K) above the crossover equals the direct path's r_k to 1e-12", () => {
    // Same tolerance as above, on the r_k = s_k / c₀ scale.
    const random = seededRandom(77);
    const length = 30_000;
    const maxLag = 400;
    const series = gappySeries(random, length, 0.15, 100);
    expect(prefersFft(length, maxLag)).toBe(true);
    const automatic = autocorrelation(series, maxLag);
    const direct = directLagProductSums(automatic.deviations, maxLag);
    const exactPairs = bruteForcePairs(series.present, maxLag);
    for (let k = 1; k <= maxLag; k++) {
      const r = automatic.correlation[k] as number;
      const rDirect = (direct[k] as number) / automatic.sumSquares;
      expectAtMost(Math.abs(r - rDirect), 1e-12, `r_${k}: fft path ${r} vs direct ${rDirect}`);
      expect(automatic.pairs[k], `pairs at lag ${k}`).toBe(exactPairs[k]);
    }
  });
});

describe("the automatic path: direct below the crossover, transform above", () => {
  it("fftCrossover(length) is one threshold: prefersFft(length, K) is K ≥ it, for every K", () => {
    for (const length of [16, 260, 701, 1024, 2048, 5000, 65_536, 1_048_576]) {
      const crossover = fftCrossover(length);
      for (let k = 1; k < Math.min(length, 3000); k++) {
        if (prefersFft(length, k) !== k >= crossover) {
          expect.fail(`length ${length}, K ${k}: prefersFft disagrees with crossover ${crossover}`);
        }
      }
    }
  });

  it("the crossover is where the cost model's transform cost first drops below the direct cost", () => {
    for (const length of [1024, 65_536, 1_048_576]) {
      const crossover = fftCrossover(length);
      const at = lagSumCosts(length, crossover);
      const below = lagSumCosts(length, crossover - 1);
      expect(at.fft < at.direct, `length ${length}: transform cheaper at K ${crossover}`).toBe(
        true,
      );
      expect(
        below.fft >= below.direct,
        `length ${length}: direct cheaper at K ${crossover - 1}`,
      ).toBe(true);
    }
  });

  it("short series and few lags stay on the direct path; long lag lists on long series go to the transform", () => {
    // The cost model of lagProductSums.ts, whose step cost the bench measured (README, Speed:
    // the crossover line); 260 values is the block check's typical column.
    expect(fftCrossover(260)).toBe(260); // the transform never pays at 260 values
    expect(prefersFft(1_048_576, 40)).toBe(false);
    expect(prefersFft(1_048_576, 250)).toBe(true);
    expect(prefersFft(1_048_576, 1000)).toBe(true);
    const crossover = fftCrossover(65_536);
    expect(crossover >= 40 && crossover <= 160, `crossover at 2^16 is ${crossover}`).toBe(true);
  });

  it("lagProductSums(a, K) returns exactly the path's result on each side of the crossover", () => {
    const random = seededRandom(9);
    const length = 8192;
    const a = new Float64Array(length);
    for (let t = 0; t < length; t++) a[t] = random.normal();
    const crossover = fftCrossover(length);
    expect(Array.from(lagProductSums(a, crossover - 1))).toEqual(
      Array.from(directLagProductSums(a, crossover - 1)),
    );
    expect(Array.from(lagProductSums(a, crossover))).toEqual(
      Array.from(fftLagProductSums(a, crossover)),
    );
  });

  it("pairCounts(series, K) is exact on both paths, with gaps", () => {
    const random = seededRandom(10);
    const series = gappySeries(random, 5000, 0.4);
    const crossover = fftCrossover(5000);
    for (const maxLag of [crossover - 1, crossover, 2 * crossover]) {
      expect(Array.from(pairCounts(series, maxLag)), `K ${maxLag}`).toEqual(
        Array.from(bruteForcePairs(series.present, maxLag)),
      );
    }
  });
});

/** Σ_t m_t m_{t−k}, counted pair by pair (the definition). */
function bruteForcePairs(present: Uint8Array, maxLag: number): Int32Array {
  const counts = new Int32Array(maxLag + 1);
  for (let k = 0; k <= maxLag; k++) {
    for (let t = k; t < present.length; t++) {
      if (present[t] === 1 && present[t - k] === 1) counts[k] = (counts[k] as number) + 1;
    }
  }
  return counts;
}

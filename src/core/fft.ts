/**
 * The fast Fourier transform and the lag sums it gives, for many lags on long series.
 *
 * `fft` is the iterative radix-2 Cooley–Tukey transform (Cooley & Tukey 1965, Math. Comp.
 * 19:297–301): bit-reversal permutation, then log₂N stages of butterflies. O(N log N).
 *
 * `fftLagProductSums` computes s_k = Σ_t a_t a_{t−k}, k = 0..K, by the correlation theorem,
 * Σ_t a_t b_{t+k} = IDFT(conj(A)·B)_k. The series is cut into blocks of L = N − K positions; each
 * block a (zero-padded to N) is correlated with the same positions extended by the next K values
 * b (zero-padded to N). Because L + K ≤ N, lags 0..K never wrap around the circle. The two real
 * segments share one complex transform (a in the real part, b in the imaginary part, separated by
 * the symmetry of real inputs' transforms), the cross-spectra of all blocks are summed, and a
 * single inverse transform at the end gives the lag sums. Cost O(n log K); the transforms stay
 * in the cache however long the series is.
 *
 * Gap-aware: run on the centred values (0 at gaps) it gives the lag sums; run on the presence
 * mask (1 where a value exists) it gives the number of pairs at each lag.
 * Accuracy: not compensated; the error is about eps·log₂N relative to s_0 (= c₀ for centred
 * values), against about eps relative to each sum for the direct path.
 */

/** Smallest power of two ≥ x (x ≥ 1). */
export function nextPowerOfTwo(x: number): number {
  let p = 1;
  while (p < x) p *= 2;
  return p;
}

interface Twiddles {
  readonly cos: Float64Array;
  readonly sin: Float64Array;
}

const twiddleCache = new Map<number, Twiddles>();

/** cos and sin of 2πj/N for j < N/2, computed once per size. */
function twiddles(size: number): Twiddles {
  const cached = twiddleCache.get(size);
  if (cached !== undefined) return cached;
  const half = size / 2;
  const cos = new Float64Array(half);
  const sin = new Float64Array(half);
  for (let j = 0; j < half; j++) {
    const angle = (2 * Math.PI * j) / size;
    cos[j] = Math.cos(angle);
    sin[j] = Math.sin(angle);
  }
  const made = { cos, sin };
  twiddleCache.set(size, made);
  return made;
}

/**
 * In-place discrete Fourier transform of (re, im), whose common length must be a power of two:
 * X_f = Σ_t x_t e^{−2πi ft/N}, or with `inverse` the unscaled inverse Σ_f X_f e^{+2πi ft/N}
 * (divide by N to undo the forward transform).
 */
export function fft(re: Float64Array, im: Float64Array, inverse = false): void {
  const size = re.length;
  if (im.length !== size || size < 1 || (size & (size - 1)) !== 0) {
    throw new Error(
      `fft needs two arrays of one power-of-two length (got ${size} and ${im.length})`,
    );
  }
  for (let i = 0, j = 0; i < size; i++) {
    if (i < j) {
      const r = re[i] as number;
      re[i] = re[j] as number;
      re[j] = r;
      const m = im[i] as number;
      im[i] = im[j] as number;
      im[j] = m;
    }
    let bit = size >> 1;
    while (bit > 0 && (j & bit) !== 0) {
      j ^= bit;
      bit >>= 1;
    }
    j |= bit;
  }
  const { cos, sin } = twiddles(size);
  const sign = inverse ? 1 : -1;
  for (let half = 1; half < size; half *= 2) {
    const step = size / (2 * half);
    for (let j = 0; j < half; j++) {
      const wr = cos[j * step] as number;
      const wi = sign * (sin[j * step] as number);
      for (let i = j; i < size; i += 2 * half) {
        const k = i + half;
        const xr = (re[k] as number) * wr - (im[k] as number) * wi;
        const xi = (re[k] as number) * wi + (im[k] as number) * wr;
        re[k] = (re[i] as number) - xr;
        im[k] = (im[i] as number) - xi;
        re[i] = (re[i] as number) + xr;
        im[i] = (im[i] as number) + xi;
      }
    }
  }
}

/**
 * Transform length for the blocked lag sums: the power of two ≥ 4(K + 1), so that at least three
 * quarters of each transform is new data, but no longer than one block holding the whole series.
 */
export function fftBlockSize(length: number, maxLag: number): number {
  return Math.min(nextPowerOfTwo(4 * (maxLag + 1)), nextPowerOfTwo(length + maxLag));
}

/** s_k = Σ_t a_t a_{t−k} for k = 0..maxLag by blocked, zero-padded transforms. O(n log K). */
export function fftLagProductSums(a: ArrayLike<number>, maxLag: number): Float64Array {
  const length = a.length;
  const size = fftBlockSize(length, maxLag);
  const blockLength = size - maxLag;
  const re = new Float64Array(size);
  const im = new Float64Array(size);
  // Cross-spectrum Σ_blocks conj(A)·B for f = 0..N/2 (the rest follows by symmetry), times 4.
  const spectrumRe = new Float64Array(size);
  const spectrumIm = new Float64Array(size);
  const half = size / 2;
  for (let from = 0; from < length; from += blockLength) {
    const to = Math.min(length, from + blockLength);
    const end = Math.min(length, to + maxLag);
    re.fill(0);
    im.fill(0);
    for (let t = from; t < to; t++) re[t - from] = a[t] as number;
    for (let t = from; t < end; t++) im[t - from] = a[t] as number;
    fft(re, im);
    for (let f = 0; f <= half; f++) {
      const g = (size - f) & (size - 1);
      const zr = re[f] as number;
      const zi = im[f] as number;
      const gr = re[g] as number;
      const gi = im[g] as number;
      // 2A = Z_f + conj(Z_g), 2B = (Z_f − conj(Z_g))/i, for the two real segments a and b.
      const ar = zr + gr;
      const ai = zi - gi;
      const br = zi + gi;
      const bi = gr - zr;
      spectrumRe[f] = (spectrumRe[f] as number) + ar * br + ai * bi;
      spectrumIm[f] = (spectrumIm[f] as number) + ar * bi - ai * br;
    }
  }
  // The correlation is real, so its spectrum is conjugate-symmetric: fill in f = N/2+1..N−1.
  for (let f = half + 1; f < size; f++) {
    spectrumRe[f] = spectrumRe[size - f] as number;
    spectrumIm[f] = -(spectrumIm[size - f] as number);
  }
  fft(spectrumRe, spectrumIm, true);
  const sums = new Float64Array(maxLag + 1);
  const scale = 1 / (4 * size);
  for (let k = 0; k <= maxLag; k++) sums[k] = (spectrumRe[k] as number) * scale;
  return sums;
}

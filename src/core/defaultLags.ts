/**
 * The default number of lags: K = min(10, ⌊n/5⌋) without a season and K = min(2m, ⌊n/5⌋) with
 * season m, clamped to 1 ≤ K ≤ n − 1. Common practice (no source): a forecasting rule of thumb;
 * ⌊n/5⌋ keeps Ljung–Box close to its χ² reference in small samples.
 */
export function defaultMaxLag(n: number, season: number | null): number {
  const preferred = season === null ? 10 : 2 * season;
  const k = Math.min(preferred, Math.floor(n / 5));
  return Math.max(1, Math.min(k, n - 1));
}

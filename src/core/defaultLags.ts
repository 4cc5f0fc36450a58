/**
 * The default number of lags: K = min(10, ⌊n/5⌋) without a season and K = min(2m, ⌊n/5⌋) with
 * season m, clamped to 1 ≤ K ≤ n − 1. Common practice (no source): a forecasting rule of thumb;
 * ⌊n/5⌋ keeps the number of pairs per lag ample.
 *
 * With a season, a K that stops short of the seasonal lags is raised to include them where the
 * series allows a verdict: to 2m when 2m ≤ n/4, else to m when m ≤ n/4 (the verdict judges up to
 * K = n/4). Otherwise the seasonal lag stays untested and the verdict's reason says so
 * (`untestedSeasonalLags`).
 *
 * @example
 * defaultMaxLag(240, null); // → 10
 * defaultMaxLag(30, null); // → 6
 * // Weekly data with a 13-week cycle: ⌊104/5⌋ = 20 is raised to 2m = 26 (26 ≤ 104/4).
 * defaultMaxLag(104, 13); // → 26
 * // Monthly data, 5 years: 2m = 24 exceeds n/4 = 15, and K = 12 already reaches m.
 * defaultMaxLag(60, 12); // → 12
 */
export function defaultMaxLag(n: number, season: number | null): number {
  const preferred = season === null ? 10 : 2 * season;
  let k = Math.min(preferred, Math.floor(n / 5));
  if (season !== null && k < 2 * season) {
    if (2 * season <= n / 4) k = 2 * season;
    else if (k < season && season <= n / 4) k = season;
  }
  return Math.max(1, Math.min(k, n - 1));
}

/** The seasonal lags m and 2m that lie beyond K (untested). */
export function untestedSeasonalLags(season: number | null, maxLag: number): number[] {
  if (season === null) return [];
  return [season, 2 * season].filter((lag) => lag > maxLag);
}

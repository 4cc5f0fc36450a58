/**
 * The arithmetic floor of a lag analysis: the K + 1 lag dot-products Σ_t d_t d_{t+k} of data
 * that is already centred, as one plain loop per lag over a Float64Array. Every lag table has to
 * do at least this work (or find a cheaper way to the same numbers), so a case's time divided by
 * the floor's, measured in the same run, says how much the rest costs on any machine.
 */
export function floorLagDotProducts(d: Float64Array, maxLag: number): Float64Array {
  const sums = new Float64Array(maxLag + 1);
  for (let k = 0; k <= maxLag; k++) {
    let s = 0;
    for (let t = 0; t + k < d.length; t++) s += (d[t] as number) * (d[t + k] as number);
    sums[k] = s;
  }
  return sums;
}

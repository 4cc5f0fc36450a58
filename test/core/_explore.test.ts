import { it } from "vitest";
import { centre, lagTable, seriesFromNumbers } from "../../src/core";
import { readStrd, readStrdCertified } from "../helpers/fixtures";
import { exactOfDouble, exactStatistics, logRelativeError } from "../helpers/exact";
it("explore", () => {
  for (const c of readStrdCertified()) {
    const x = readStrd(c.dataset);
    const s = seriesFromNumbers(x);
    const t = lagTable(s, { maxLag: 1 });
    const { sumSquares, n } = centre(s);
    const sd = Math.sqrt(sumSquares / (n - 1));
    const r1 = t.rows[0]!.correlation;
    const ex = exactStatistics(Array.from(x, exactOfDouble));
    console.log(c.dataset, x.length, c.n,
      [t.mean, sd, r1].map((v, i) => logRelativeError(v, [c.mean, c.sd, c.r1][i]!).toFixed(2)).join(" "),
      "| allowed", [ex.mean, ex.sd, ex.r1].map((v, i) => logRelativeError(v, [c.mean, c.sd, c.r1][i]!).toFixed(2)).join(" "),
      "| vs exact", [t.mean, sd, r1].map((v, i) => logRelativeError(v, [ex.mean, ex.sd, ex.r1][i]!).toFixed(2)).join(" "));
  }
});

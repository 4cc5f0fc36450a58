/**
 * False-alarm accounting for K lags each tested at level α.
 *
 * Under white noise the sample autocorrelations are asymptotically independent and normal
 * (Box, Jenkins & Reinsel, §2.1.6), so the number of lags crossing a level-α band is about
 * Binomial(K, α): expected K·α crossings, and the chance of m or more is
 * Σ_{j≥m} C(K,j) α^j (1−α)^{K−j}, computed directly as an upper tail (distributions.ts).
 * This is approximate: the independence holds only asymptotically.
 *
 * The same count·α is the number of raw flags expected by chance when many series (a batch, an
 * audit) are each tested at level α and every one is noise: each null p falls below α with
 * probability α, and expectations add whether or not the tests are independent (linearity of
 * expectation, by definition).
 */
import { binomialUpperTail } from "./distributions";

export interface FalseAlarmNote {
  /** Lags tested (those with a defined r_k). */
  readonly tested: number;
  /** Crossings expected by chance, K·α. */
  readonly expected: number;
  /** Lags that crossed the band. */
  readonly crossings: number;
  /** The lags that crossed, ascending. */
  readonly crossingLags: readonly number[];
  /** Chance that pure noise gives at least `crossings` crossings. */
  readonly chance: number;
}

/**
 * Flags expected by chance among `count` tests at level α, all of them under the null: count·α.
 *
 * @example
 * expectedFalseFlags(150, 0.05); // ≈ 7.5
 */
export function expectedFalseFlags(count: number, alpha: number): number {
  return count * alpha;
}

export function falseAlarmNote(
  tested: number,
  alpha: number,
  crossingLags: readonly number[],
): FalseAlarmNote {
  return {
    tested,
    expected: expectedFalseFlags(tested, alpha),
    crossings: crossingLags.length,
    crossingLags,
    chance: binomialUpperTail(crossingLags.length, tested, alpha),
  };
}

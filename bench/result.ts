/** The shape of one bench case's result and the table printed from them. */

export interface CaseResult {
  readonly name: string;
  readonly n: number;
  readonly k: number;
  /** Median time of the case, ms (null where the case is not a time). */
  readonly medianMs: number | null;
  /** Median time of what the case is compared with, ms, measured interleaved in the same run. */
  readonly floorMs: number | null;
  /** The figure judged against the target (see `measure`). */
  readonly ratio: number;
  /** Upper bound, or [low, high] for the growth slope. */
  readonly target: number | readonly [number, number];
  readonly ok: boolean;
  /** What `ratio` is. */
  readonly measure: string;
  /** Case-specific details (sizes, times, bytes, the crossover). */
  readonly detail?: Readonly<Record<string, unknown>>;
}

export function withinTarget(ratio: number, target: number | readonly [number, number]): boolean {
  if (typeof target === "number") return ratio <= target;
  return ratio >= target[0] && ratio <= target[1];
}

function figure(x: number | null, digits = 2): string {
  return x === null ? "–" : x.toFixed(digits);
}

function targetText(target: number | readonly [number, number]): string {
  return typeof target === "number" ? `≤ ${target}` : `${target[0]}–${target[1]}`;
}

/** A Markdown table of the results (the README's Speed section pastes one). */
export function resultTable(cases: readonly CaseResult[]): string {
  const lines = [
    "| case | n | K | median ms | floor ms | ratio | target | ok | ratio is |",
    "| --- | ---: | ---: | ---: | ---: | ---: | ---: | :---: | --- |",
  ];
  for (const c of cases) {
    lines.push(
      `| ${c.name} | ${c.n} | ${c.k} | ${figure(c.medianMs)} | ${figure(c.floorMs)} | ${figure(c.ratio, 3)} | ${targetText(c.target)} | ${c.ok ? "yes" : "**no**"} | ${c.measure} |`,
    );
  }
  return lines.join("\n");
}

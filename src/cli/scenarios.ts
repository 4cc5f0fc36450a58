/**
 * The bundled demo scenarios (invented; written by scripts/generate-demo.ts) and the options each
 * is meant to be read with.
 */
import { resolve } from "node:path";
import type { LagOptions } from "../core";

export interface DemoScenario {
  readonly title: string;
  readonly file: string;
  readonly story: string;
  /** The readings shown for every series, each with its options. */
  readonly readings: readonly { readonly name: string; readonly options: LagOptions }[];
}

/** build/echolot.cjs sits one level below the package root, beside demo/. */
export function demoDirectory(): string {
  return resolve(__dirname, "..", "demo");
}

export const DEMO_SCENARIOS: readonly DemoScenario[] = [
  {
    title: "Ternpoint Roasters — weekly forecast errors, 24 blends, 104 weeks",
    file: "ternpoint-roasters-forecast-errors.csv",
    story:
      "Some blends are clean, some under-react (lag-1 dependence), some keep a 13-week promotion cycle, two are biased (bias is not a lag pattern: the bias check finds it).",
    readings: [{ name: "season 13", options: { season: 13 } }],
  },
  {
    title: "Larkvale Balanced Fund — daily return-model residuals, 750 days",
    file: "larkvale-fund-residuals.csv",
    story:
      "Volatility clustering and no linear dependence: plain bands over-alarm; robust bands and the squared-residual check tell the true story.",
    readings: [
      {
        name: "noise bands, Ljung–Box",
        options: { bandKind: "noise", testKind: "ljung-box", maxLag: 20 },
      },
      {
        name: "robust bands, robust Q*",
        options: { bandKind: "robust", testKind: "robust", maxLag: 20 },
      },
      { name: "squared deviations (McLeod–Li)", options: { testKind: "squares", maxLag: 20 } },
    ],
  },
];

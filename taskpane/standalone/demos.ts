/**
 * The demo scenarios, bundled into the page at build time (no request is made for them), with
 * the settings each is meant to be read with. The data are invented (scripts/generate-demo.ts).
 */
import type { LagOptions } from "../../src/core";
import larkvale from "../../demo/larkvale-fund-residuals.csv?raw";
import ternpoint from "../../demo/ternpoint-roasters-forecast-errors.csv?raw";

export interface DemoChoice {
  readonly id: string;
  readonly title: string;
  readonly story: string;
  readonly file: string;
  readonly text: string;
  readonly options: LagOptions;
}

export const DEMOS: readonly DemoChoice[] = [
  {
    id: "ternpoint",
    title: "Ternpoint Roasters: weekly forecast errors, 24 blends",
    story:
      "104 weeks of forecast errors. Some blends are clean, some under-react (lag-1 dependence), some keep a 13-week promotion cycle, two are biased.",
    file: "ternpoint-roasters-forecast-errors.csv",
    text: ternpoint,
    options: { season: 13 },
  },
  {
    id: "larkvale-plain",
    title: "Larkvale Balanced Fund: daily residuals, noise bands",
    story:
      "750 days of return-model residuals with volatility clustering and no linear dependence. With plain bands the pane over-alarms; compare the robust reading.",
    file: "larkvale-fund-residuals.csv",
    text: larkvale,
    options: { maxLag: 20, bandKind: "noise", testKind: "ljung-box" },
  },
  {
    id: "larkvale-robust",
    title: "Larkvale Balanced Fund: daily residuals, robust bands",
    story:
      "The same residuals read with robust bands and the robust joint test, which allow for the volatility clustering; the squared-deviations tab shows the clustering itself.",
    file: "larkvale-fund-residuals.csv",
    text: larkvale,
    options: { maxLag: 20, bandKind: "robust", testKind: "robust" },
  },
];

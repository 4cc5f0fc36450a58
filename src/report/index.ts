/** Pure builders of what people see: text, SVG, explanations, report plans. Imports only the core. */
export * from "./escape";
export * from "./palette";
export * from "./verdictBadge";
export * from "./lagTableText";
export * from "./lagViews";
export * from "./evidenceChart";
export * from "./jointRibbon";
export * from "./explain";
export * from "./htmlParts";
export * from "./htmlReport";
export * from "./lagTableHeader";
export * from "./placedReport";
export * from "./seriesReport";
export * from "./portableFormulas";
export * from "./portablePlan";
export * from "./portableBatch";
export * from "./portableChartXml";

/** Pure builders of what people see: text, SVG, explanations. Imports only the core. */
export * from "./verdictBadge";
export * from "./lagTableText";

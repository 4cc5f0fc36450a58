/**
 * Small helpers shared by the SVG builders: fixed rounding of coordinates (so equal input gives
 * byte-equal output and the strings stay short) and attribute lists with escaped values.
 */
import { escapeMarkup } from "./escape";

/** A coordinate rounded to one decimal, written without a trailing ".0" and never as "-0". */
export function px(x: number): string {
  const rounded = Math.round(x * 10) / 10;
  return String(rounded === 0 ? 0 : rounded);
}

/** A figure for a data attribute or a title: up to 6 significant digits, "NaN" when undefined. */
export function figure(x: number, digits = 6): string {
  if (!Number.isFinite(x)) return String(x);
  const value = Number(x.toPrecision(digits));
  return String(value === 0 ? 0 : value);
}

export type Attributes = Readonly<Record<string, string | number | undefined>>;

/** ` name="value"` pairs, escaped; undefined values are left out. */
export function attributes(attrs: Attributes): string {
  return Object.entries(attrs)
    .filter((entry): entry is [string, string | number] => entry[1] !== undefined)
    .map(([name, value]) => ` ${name}="${escapeMarkup(String(value))}"`)
    .join("");
}

/** An element with escaped attributes and already-built inner markup (or none). */
export function element(name: string, attrs: Attributes, inner?: string): string {
  return inner === undefined
    ? `<${name}${attributes(attrs)}/>`
    : `<${name}${attributes(attrs)}>${inner}</${name}>`;
}

/**
 * The root <svg> of a chart: its size, view box, the ids of its title and description for
 * assistive technology, and any further attributes after those.
 */
export function svgRoot(
  className: string,
  width: number,
  height: number,
  idPrefix: string,
  inner: string,
  extra: Attributes = {},
): string {
  return element(
    "svg",
    {
      xmlns: "http://www.w3.org/2000/svg",
      class: className,
      width,
      height,
      viewBox: `0 0 ${width} ${height}`,
      role: "img",
      "aria-labelledby": `${idPrefix}-title ${idPrefix}-desc`,
      "font-family": "system-ui, sans-serif",
      ...extra,
    },
    inner,
  );
}

/** An element holding text, escaped. */
export function textElement(name: string, attrs: Attributes, text: string): string {
  return element(name, attrs, escapeMarkup(text));
}

/** A figure in prose with a true minus sign: "−0.39". */
export function signed(x: number, digits = 3): string {
  return figure(x, digits).replace(/^-/, "−");
}

/**
 * Reading an evidence chart or ribbon back from its SVG string with a strict XML parse (so the
 * string is also proven well-formed): diamonds with their lag, z and centre, corridors with their
 * level and pixel bounds.
 */
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { seriesFromValues, type Series } from "../../src/core";
import { descendants, parseXml, type XmlElement } from "../manifest/xml";

export interface Diamond {
  readonly lag: number;
  readonly z: number;
  readonly zone: string;
  readonly pinned: boolean;
  readonly fill: string;
  readonly x: number;
  readonly y: number;
  readonly title: string;
}

export interface Corridor {
  readonly name: string;
  readonly level: number;
  readonly top: number;
  readonly bottom: number;
}

export function elements(svg: string): XmlElement[] {
  return descendants(parseXml(svg));
}

function classes(element: XmlElement): string[] {
  return (element.attributes.class ?? "").split(/\s+/).filter((c) => c !== "");
}

export function withClass(svg: string, name: string): XmlElement[] {
  return elements(svg).filter((e) => classes(e).includes(name));
}

/** The diamond's centre from its path "Mx,y−sLx+s,yLx,y+sLx−s,yZ". */
function centre(d: string): { x: number; y: number } {
  const numbers = d.match(/-?\d+(\.\d+)?/g)?.map(Number) ?? [];
  return { x: numbers[0] as number, y: numbers[3] as number };
}

export function diamonds(svg: string): Diamond[] {
  return elements(svg)
    .filter((e) => e.local === "path" && classes(e).includes("lag"))
    .map((e) => {
      const c = classes(e);
      const { x, y } = centre(e.attributes.d ?? "");
      return {
        lag: Number(e.attributes["data-lag"]),
        z: Number(e.attributes["data-z"]),
        zone: c.find((k) => k === "inside" || k === "between" || k === "beyond") ?? "",
        pinned: c.includes("pinned"),
        fill: e.attributes.fill ?? "",
        x,
        y,
        title: e.children.find((t) => t.local === "title")?.text ?? "",
      };
    });
}

export function corridors(svg: string): Corridor[] {
  return withClass(svg, "corridor").map((e) => {
    const top = Number(e.attributes.y);
    return {
      name: classes(e).includes("outer") ? "outer" : "inner",
      level: Number(e.attributes["data-level"]),
      top,
      bottom: top + Number(e.attributes.height),
    };
  });
}

/** Box–Jenkins Series F (70 batch yields), from the fixture copy of the outside dataset. */
export function seriesF(label?: string): Series {
  const lines = readFileSync(join(__dirname, "..", "fixtures", "series-f.csv"), "utf8")
    .trim()
    .split(/\r?\n/);
  const series = seriesFromValues(lines.slice(1).map(Number), { label: label ?? lines[0] ?? "" });
  return series;
}

/**
 * Writes portable report plans (src/report/portablePlan.ts) into an xlsx workbook: exceljs lays
 * out the cells (formulas with the file format's `_xlfn.` prefixes, number formats, fonts,
 * widths), then the native charts, which exceljs does not write, are added to the package as
 * DrawingML parts. No cached values are written for formulas and the workbook asks for a full
 * recalculation on load, so every spreadsheet computes the figures itself.
 */
import type ExcelJS from "exceljs";
import type JSZip from "jszip";
import {
  chartPartXml,
  columnLetters,
  drawingPartXml,
  fileFormula,
  type PortableChart,
  type PortablePlan,
  type PortableStyle,
} from "../report";
import { PALETTE } from "../report/palette";

const FONTS: Readonly<Record<PortableStyle, Partial<ExcelJS.Font>>> = {
  title: { bold: true, size: 14 },
  heading: { bold: true },
  verdict: { bold: true, size: 12 },
  note: { italic: true, color: { argb: `FF${PALETTE.muted.slice(1)}` } },
};

export const CHART_DESCRIPTION =
  "Each lag's standardised value z as a diamond: slate inside the one-lag corridor, orange between the corridors (could be chance, given how many lags were tested), vermillion beyond the all-lags corridor (survives the multiple-lag correction). The pale bands are the two corridors.";

export interface PlacedChart {
  readonly sheet: string;
  readonly chart: PortableChart;
}

/** Adds the plan's sheets to `workbook`; returns the charts still to be added to the file. */
export function addPortableSheets(workbook: ExcelJS.Workbook, plan: PortablePlan): PlacedChart[] {
  const charts: PlacedChart[] = [];
  for (const sheetPlan of plan.sheets) {
    const sheet = workbook.addWorksheet(sheetPlan.name);
    for (const { column, width } of sheetPlan.widths) sheet.getColumn(column + 1).width = width;
    for (const cell of sheetPlan.cells) {
      const target = sheet.getCell(cell.row + 1, cell.column + 1);
      target.value =
        "formula" in cell.content
          ? ({ formula: fileFormula(cell.content.formula) } as ExcelJS.CellFormulaValue)
          : cell.content.value;
      if (cell.format !== undefined) target.numFmt = cell.format;
      if (cell.style !== undefined) target.font = FONTS[cell.style];
    }
    if (sheetPlan.print !== undefined) {
      sheet.pageSetup = {
        ...sheet.pageSetup,
        orientation: "landscape",
        fitToPage: true,
        fitToWidth: 1,
        fitToHeight: 0,
        printArea: `A1:${columnLetters(sheetPlan.print.columns - 1)}${sheetPlan.print.rows}`,
      };
    }
    if (sheetPlan.chart !== undefined)
      charts.push({ sheet: sheetPlan.name, chart: sheetPlan.chart });
  }
  workbook.calcProperties = { ...workbook.calcProperties, fullCalcOnLoad: true };
  return charts;
}

const REL_DRAWING = "http://schemas.openxmlformats.org/officeDocument/2006/relationships/drawing";
const REL_CHART = "http://schemas.openxmlformats.org/officeDocument/2006/relationships/chart";
const TYPE_DRAWING = "application/vnd.openxmlformats-officedocument.drawing+xml";
const TYPE_CHART = "application/vnd.openxmlformats-officedocument.drawingml.chart+xml";
/** Worksheet elements that must follow <drawing> (ECMA-376 CT_Worksheet order). */
const AFTER_DRAWING = [
  "<legacyDrawing",
  "<legacyDrawingHF",
  "<picture",
  "<oleObjects",
  "<controls",
  "<webPublishItems",
  "<tableParts",
  "<extLst",
  "</worksheet>",
];

function decodeXmlText(text: string): string {
  return text
    .replace(/&quot;/g, '"')
    .replace(/&apos;/g, "'")
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&amp;/g, "&");
}

/** Path of each worksheet's part, by sheet name, from workbook.xml and its relationships. */
async function sheetParts(zip: JSZip): Promise<Map<string, string>> {
  const workbook = await readPart(zip, "xl/workbook.xml");
  const rels = await readPart(zip, "xl/_rels/workbook.xml.rels");
  const targets = new Map<string, string>();
  for (const m of rels.matchAll(/<Relationship\b[^>]*>/g)) {
    const id = /\bId="([^"]+)"/.exec(m[0])?.[1];
    const target = /\bTarget="([^"]+)"/.exec(m[0])?.[1];
    if (id !== undefined && target !== undefined) {
      targets.set(id, target.startsWith("/") ? target.slice(1) : `xl/${target}`);
    }
  }
  const parts = new Map<string, string>();
  for (const m of workbook.matchAll(/<sheet\b[^>]*>/g)) {
    const name = /\bname="([^"]*)"/.exec(m[0])?.[1];
    const id = /\br:id="([^"]+)"/.exec(m[0])?.[1];
    const part = id === undefined ? undefined : targets.get(id);
    if (name !== undefined && part !== undefined) parts.set(decodeXmlText(name), part);
  }
  return parts;
}

async function readPart(zip: JSZip, path: string): Promise<string> {
  const file = zip.file(path);
  if (file === null) throw new Error(`the workbook package has no ${path}`);
  return file.async("string");
}

/** The workbook's bytes with each chart added as a drawing on its sheet. */
export async function withCharts(
  bytes: ArrayBuffer | Uint8Array,
  charts: readonly PlacedChart[],
): Promise<Buffer> {
  // Loaded here, not at the top: every command's start would otherwise read jszip's 66 files.
  const { default: Zip } = await import("jszip");
  const zip = await Zip.loadAsync(bytes);
  // exceljs writes a print area as $A1:$N78; LibreOffice ignores that form, so make it $A$1:$N$78.
  const workbookXml = await readPart(zip, "xl/workbook.xml");
  zip.file(
    "xl/workbook.xml",
    workbookXml.replace(/(!\$[A-Z]+)(\d+):(\$[A-Z]+)(\d+)</g, "$1$$$2:$3$$$4<"),
  );
  if (charts.length > 0) {
    const parts = await sheetParts(zip);
    let types = await readPart(zip, "[Content_Types].xml");
    let index = 0;
    for (const { sheet, chart } of charts) {
      index++;
      const part = parts.get(sheet);
      if (part === undefined) throw new Error(`no worksheet "${sheet}" for its chart`);
      zip.file(`xl/charts/chart${index}.xml`, chartPartXml(sheet, chart));
      zip.file(`xl/drawings/drawing${index}.xml`, drawingPartXml(chart, CHART_DESCRIPTION));
      zip.file(
        `xl/drawings/_rels/drawing${index}.xml.rels`,
        relationships([{ id: "rId1", type: REL_CHART, target: `../charts/chart${index}.xml` }]),
      );
      const relsPath = part.replace(/([^/]+)$/, "_rels/$1.rels");
      const existing = zip.file(relsPath) === null ? "" : await readPart(zip, relsPath);
      const id = `rIdEcholotDrawing${index}`;
      const rel = `<Relationship Id="${id}" Type="${REL_DRAWING}" Target="../drawings/drawing${index}.xml"/>`;
      zip.file(
        relsPath,
        existing === ""
          ? relationships([{ id, type: REL_DRAWING, target: `../drawings/drawing${index}.xml` }])
          : existing.replace("</Relationships>", `${rel}</Relationships>`),
      );
      zip.file(part, insertDrawing(await readPart(zip, part), id));
      types = types.replace(
        "</Types>",
        `<Override PartName="/xl/charts/chart${index}.xml" ContentType="${TYPE_CHART}"/><Override PartName="/xl/drawings/drawing${index}.xml" ContentType="${TYPE_DRAWING}"/></Types>`,
      );
    }
    zip.file("[Content_Types].xml", types);
  }
  return zip.generateAsync({ type: "nodebuffer", compression: "DEFLATE" });
}

function relationships(list: readonly { id: string; type: string; target: string }[]): string {
  const items = list
    .map((r) => `<Relationship Id="${r.id}" Type="${r.type}" Target="${r.target}"/>`)
    .join("");
  return `<?xml version="1.0" encoding="UTF-8" standalone="yes"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">${items}</Relationships>`;
}

function insertDrawing(sheetXml: string, id: string): string {
  let xml = sheetXml;
  if (!/<worksheet\b[^>]*\bxmlns:r=/.test(xml)) {
    xml = xml.replace(
      /<worksheet\b/,
      '<worksheet xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"',
    );
  }
  const at = AFTER_DRAWING.map((tag) => xml.indexOf(tag))
    .filter((position) => position >= 0)
    .reduce((first, position) => Math.min(first, position), Infinity);
  return `${xml.slice(0, at)}<drawing r:id="${id}"/>${xml.slice(at)}`;
}

/** The workbook as xlsx bytes, charts included. */
export async function portableWorkbookBytes(
  workbook: ExcelJS.Workbook,
  charts: readonly PlacedChart[],
): Promise<Buffer> {
  const bytes = await workbook.xlsx.writeBuffer();
  return withCharts(bytes as ArrayBuffer, charts);
}

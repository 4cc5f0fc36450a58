/**
 * The portable report's native chart as the xlsx file format holds it (a DrawingML chart part and
 * the drawing that anchors it to cells; ECMA-376 Part 1, §21.2 and §20.5): the two corridors as
 * flat stacked areas (an invisible base up to −outer, then the lower outer band, the inner band
 * and the upper outer band: no area overlaps another, so no engine's drawing order matters), and
 * each lag's z as a diamond without a line in one of three series, coloured by zone. Cells that
 * hold #N/A are not drawn, so a diamond shows only in the series of its own zone. No stems, no
 * bars, no dashed band lines. Pure: strings in, strings out.
 */
import { escapeMarkup } from "./escape";
import { PALETTE } from "./palette";
import { columnRange } from "./portableFormulas";
import type { PortableChart, PortableColumn } from "./portableTypes";

const NS_C = "http://schemas.openxmlformats.org/drawingml/2006/chart";
const NS_A = "http://schemas.openxmlformats.org/drawingml/2006/main";
const NS_R = "http://schemas.openxmlformats.org/officeDocument/2006/relationships";
const CATEGORY_AXIS = 50010;
const VALUE_AXIS = 50020;

function colour(hex: string | null): string {
  if (hex === null) return "<a:noFill/>";
  return `<a:solidFill><a:srgbClr val="${hex.replace("#", "").toUpperCase()}"/></a:solidFill>`;
}

function rich(text: string, size: number, bold: boolean, vertical = false): string {
  const body = vertical ? '<a:bodyPr rot="-5400000" vert="horz"/>' : "<a:bodyPr/>";
  const run = `<a:rPr lang="en-US" sz="${size}" b="${bold ? 1 : 0}">${colour(PALETTE.ink)}</a:rPr>`;
  return `<c:tx><c:rich>${body}<a:p><a:pPr><a:defRPr sz="${size}" b="${bold ? 1 : 0}"/></a:pPr><a:r>${run}<a:t>${escapeMarkup(text)}</a:t></a:r></a:p></c:rich></c:tx><c:overlay val="0"/>`;
}

function reference(sheet: string, column: PortableColumn): string {
  return `<c:numRef><c:f>${escapeMarkup(columnRange(sheet, column))}</c:f></c:numRef>`;
}

/** The chart part for `chart`, whose cells are on `sheet`. */
export function chartPartXml(sheet: string, chart: PortableChart): string {
  const categories = `<c:cat>${reference(sheet, chart.categories)}</c:cat>`;
  const areas: string[] = [];
  const lines: string[] = [];
  const hidden: number[] = [];
  chart.series.forEach((s, index) => {
    const head = `<c:idx val="${index}"/><c:order val="${index}"/><c:tx><c:v>${escapeMarkup(s.name)}</c:v></c:tx>`;
    const values = `<c:val>${reference(sheet, s.values)}</c:val>`;
    if (!s.inLegend) hidden.push(index);
    if (s.type === "area") {
      areas.push(
        `<c:ser>${head}<c:spPr>${colour(s.colour)}<a:ln><a:noFill/></a:ln></c:spPr>${categories}${values}</c:ser>`,
      );
    } else {
      const fill = `<c:spPr>${colour(s.colour)}<a:ln w="6350">${colour(s.colour)}</a:ln></c:spPr>`;
      lines.push(
        `<c:ser>${head}<c:spPr><a:ln w="19050"><a:noFill/></a:ln></c:spPr><c:marker><c:symbol val="diamond"/><c:size val="9"/>${fill}</c:marker>${categories}${values}<c:smooth val="0"/></c:ser>`,
      );
    }
  });
  const axes = `<c:axId val="${CATEGORY_AXIS}"/><c:axId val="${VALUE_AXIS}"/>`;
  const axisLine = `<c:spPr><a:ln w="9525">${colour(PALETTE.muted)}</a:ln></c:spPr>`;
  const ticks = `<c:txPr><a:bodyPr/><a:p><a:pPr><a:defRPr sz="900">${colour(PALETTE.ink)}</a:defRPr></a:pPr><a:endParaRPr lang="en-US"/></a:p></c:txPr>`;
  const legendEntries = hidden
    .map((i) => `<c:legendEntry><c:idx val="${i}"/><c:delete val="1"/></c:legendEntry>`)
    .join("");
  return [
    '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>',
    `<c:chartSpace xmlns:c="${NS_C}" xmlns:a="${NS_A}" xmlns:r="${NS_R}">`,
    '<c:roundedCorners val="0"/>',
    "<c:chart>",
    `<c:title>${rich(chart.title, 1200, true)}</c:title>`,
    '<c:autoTitleDeleted val="0"/>',
    "<c:plotArea><c:layout/>",
    `<c:areaChart><c:grouping val="stacked"/><c:varyColors val="0"/>${areas.join("")}${axes}</c:areaChart>`,
    `<c:lineChart><c:grouping val="standard"/><c:varyColors val="0"/>${lines.join("")}<c:marker val="1"/>${axes}</c:lineChart>`,
    `<c:catAx><c:axId val="${CATEGORY_AXIS}"/><c:scaling><c:orientation val="minMax"/></c:scaling><c:delete val="0"/><c:axPos val="b"/>`,
    `<c:title>${rich(chart.xTitle, 1000, false)}</c:title><c:numFmt formatCode="0" sourceLinked="0"/>`,
    `<c:majorTickMark val="none"/><c:minorTickMark val="none"/><c:tickLblPos val="low"/><c:spPr><a:ln><a:noFill/></a:ln></c:spPr>${ticks}`,
    `<c:crossAx val="${VALUE_AXIS}"/><c:crosses val="autoZero"/><c:auto val="1"/><c:lblAlgn val="ctr"/><c:lblOffset val="100"/><c:noMultiLvlLbl val="0"/></c:catAx>`,
    `<c:valAx><c:axId val="${VALUE_AXIS}"/><c:scaling><c:orientation val="minMax"/></c:scaling><c:delete val="0"/><c:axPos val="l"/>`,
    `<c:title>${rich(chart.yTitle, 1000, false, true)}</c:title><c:numFmt formatCode="0" sourceLinked="0"/>`,
    `<c:majorTickMark val="out"/><c:minorTickMark val="none"/><c:tickLblPos val="nextTo"/>${axisLine}${ticks}`,
    `<c:crossAx val="${CATEGORY_AXIS}"/><c:crosses val="autoZero"/><c:crossBetween val="between"/></c:valAx>`,
    "</c:plotArea>",
    `<c:legend><c:legendPos val="b"/>${legendEntries}<c:overlay val="0"/>${ticks}</c:legend>`,
    '<c:plotVisOnly val="1"/><c:dispBlanksAs val="gap"/>',
    "</c:chart>",
    "</c:chartSpace>",
  ].join("");
}

/** The drawing part that anchors chart relationship `rId1` between the chart's two cells. */
export function drawingPartXml(chart: PortableChart, description: string): string {
  const corner = (tag: string, at: { row: number; column: number }) =>
    `<xdr:${tag}><xdr:col>${at.column}</xdr:col><xdr:colOff>0</xdr:colOff><xdr:row>${at.row}</xdr:row><xdr:rowOff>0</xdr:rowOff></xdr:${tag}>`;
  return [
    '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>',
    `<xdr:wsDr xmlns:xdr="http://schemas.openxmlformats.org/drawingml/2006/spreadsheetDrawing" xmlns:a="${NS_A}">`,
    "<xdr:twoCellAnchor>",
    corner("from", chart.from),
    corner("to", chart.to),
    '<xdr:graphicFrame macro="">',
    `<xdr:nvGraphicFramePr><xdr:cNvPr id="2" name="${escapeMarkup(chart.title)}" descr="${escapeMarkup(description)}"/><xdr:cNvGraphicFramePr/></xdr:nvGraphicFramePr>`,
    '<xdr:xfrm><a:off x="0" y="0"/><a:ext cx="0" cy="0"/></xdr:xfrm>',
    `<a:graphic><a:graphicData uri="${NS_C}"><c:chart xmlns:c="${NS_C}" xmlns:r="${NS_R}" r:id="rId1"/></a:graphicData></a:graphic>`,
    "</xdr:graphicFrame><xdr:clientData/></xdr:twoCellAnchor></xdr:wsDr>",
  ].join("");
}

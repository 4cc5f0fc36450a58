/**
 * An in-memory stand-in for the slice of the spreadsheet host's API the pane uses (an equivalent
 * of office-addin-mock with a real cell grid): worksheets, ranges by address and by indexes, used
 * ranges and intersections, values, value types and formulas, charts with series, and the
 * selection, change and calculation events. Each behaviour follows the host's documentation, cited
 * beside it ("@types" is the doc comment in node_modules/@types/office-js/index.d.ts, which carries
 * the learn.microsoft.com reference text; "learn" is a learn.microsoft.com/office/dev/add-ins page):
 *
 * - a property can be read only after `load` and `sync` (learn: "Excel JavaScript object model",
 *   load and sync), so the glue cannot skip a load it would need in a real workbook;
 * - an error cell reads through `values` as its error string and through `valueTypes` as "Error"
 *   (@types Excel.Range.values, Excel.RangeValueType);
 * - `getSelectedRange` fails when the selection has several areas (@types
 *   Excel.Workbook.getSelectedRange: "If there are multiple ranges selected, this method will throw
 *   an error"; code InvalidSelection of Excel.ErrorCodes); `getSelectedRanges` needs ExcelApi 1.9;
 * - `activate()` moves the selection to the activated sheet, so the selection event fires
 *   (@types Excel.Worksheet.activate, Excel.Workbook.onSelectionChanged);
 * - the add-in's own writes fire `onChanged` with triggerSource "ThisLocalAddin"
 *   (@types Excel.WorksheetChangedEventArgs.triggerSource);
 * - events arrive after the batch that caused them, not inside it (learn: "Work with events using
 *   the Excel JavaScript API": handlers run when the event fires, asynchronously);
 * - an event handler is removed only through the context it was added in, inside an
 *   `Excel.run(thatContext, …)` (@types OfficeExtension.EventHandlerResult; learn: "Work with
 *   events…", "Remove an event handler");
 * - `sync` can fail, failing the whole batch (learn: "Error handling with the application-specific
 *   JavaScript APIs"); a test arms a failure with `failNextSync`;
 * - a request or a response larger than 5 MB, or a read of more than five million cells, fails
 *   (learn: "Resource limits and performance optimization for Office Add-ins", section "Excel
 *   add-ins"; codes RequestPayloadSizeLimitExceeded, ResponsePayloadSizeLimitExceeded and
 *   RangeExceedsLimit of Excel.ErrorCodes);
 * - a sheet name is at most 31 characters, not blank, without \ / ? * [ ] :, not starting or
 *   ending with an apostrophe, and unique ignoring case (@types Excel.Worksheet.name; learn:
 *   "Work with worksheets using the Excel JavaScript API"; support.microsoft.com "Rename a
 *   worksheet"); otherwise `worksheets.add` fails with InvalidArgument or ItemAlreadyExists;
 * - `Office.addin.onVisibilityModeChanged` tells the page when the task pane is shown or hidden
 *   and resolves to a function that removes the handler (@types Office.Addin).
 *
 * Every member the glue touches is recorded by its Excel type and name ("Range.values") in
 * `used`, for the test that checks the manifest's requirement set covers them.
 */
import type { ApiSupport, ExcelRun } from "../../taskpane/host/excel";

interface Area {
  r0: number;
  c0: number;
  r1: number;
  c1: number;
}

/** What an error cell holds, such as "#N/A" (written by NA()) or "#DIV/0!". */
export class CellErrorValue {
  constructor(readonly code: string) {}
}

/** An error cell's content, for `fill` and `setFormula`. */
export const errorValue = (code: string): CellErrorValue => new CellErrorValue(code);

interface Cell {
  value: unknown;
  formula: string;
}

export interface ChangeEvent {
  address: string;
  worksheetId: string;
  type: "WorksheetChanged";
  changeType: "RangeEdited";
  source: "Local";
  triggerSource: "Unknown" | "ThisLocalAddin";
}

export interface CalculatedEvent {
  worksheetId: string;
  type: "WorksheetCalculated";
}

/** A failed request as office.js reports it: an OfficeExtension.Error with a code. */
export class FakeRequestError extends Error {
  constructor(
    readonly code: string,
    message: string,
  ) {
    super(message);
    this.name = "RichApi.Error";
  }
}

function letters(column: number): string {
  let n = column + 1;
  let s = "";
  while (n > 0) {
    s = String.fromCharCode(65 + ((n - 1) % 26)) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

function a1(area: Area): string {
  const from = `${letters(area.c0)}${area.r0 + 1}`;
  const to = `${letters(area.c1)}${area.r1 + 1}`;
  return from === to ? from : `${from}:${to}`;
}

/** One corner of an A1 reference; a whole column ("B") or row ("5") leaves the other out. */
function parseCell(text: string): { r: number | undefined; c: number | undefined } {
  const m = /^(?:\$?([A-Z]{1,3}))?(?:\$?(\d+))?$/.exec(text.trim().toUpperCase());
  if (m === null || (m[1] === undefined && m[2] === undefined)) {
    throw new Error(`fake host: unsupported address "${text}"`);
  }
  let c = 0;
  for (const ch of m[1] ?? "") c = c * 26 + ch.charCodeAt(0) - 64;
  return {
    r: m[2] === undefined ? undefined : Number(m[2]) - 1,
    c: m[1] === undefined ? undefined : c - 1,
  };
}

/** The sheet's last row and column (zero-based): 1,048,576 rows and 16,384 columns. */
const LAST_ROW = 1_048_575;
const LAST_COLUMN = 16_383;

export function parseArea(address: string): Area {
  const [from, to = from] = address.split(":") as [string, string?];
  const a = parseCell(from);
  const b = parseCell(to);
  return {
    r0: Math.min(a.r ?? 0, b.r ?? 0),
    c0: Math.min(a.c ?? 0, b.c ?? 0),
    r1: Math.max(a.r ?? LAST_ROW, b.r ?? LAST_ROW),
    c1: Math.max(a.c ?? LAST_COLUMN, b.c ?? LAST_COLUMN),
  };
}

function sheetPrefix(name: string): string {
  return /^[A-Za-z0-9_]+$/.test(name) ? name : `'${name.replace(/'/g, "''")}'`;
}

/** What `values` shows for a cell: an error cell as its error string (@types Range.values). */
function shownValue(value: unknown): unknown {
  return value instanceof CellErrorValue ? value.code : value;
}

/** The cell's Excel.RangeValueType. */
function valueType(value: unknown): string {
  if (value instanceof CellErrorValue) return "Error";
  if (value === "" || value === null || value === undefined) return "Empty";
  if (typeof value === "number") return "Double";
  if (typeof value === "boolean") return "Boolean";
  return "String";
}

/** The documented sheet-name rules; the reason a name breaks them, or undefined. */
export function sheetNameProblem(name: string): string | undefined {
  if (name.trim() === "") return "a sheet name cannot be blank";
  if (name.length > 31) return `a sheet name has at most 31 characters ("${name}")`;
  if (/[\\/?*[\]:]/.test(name)) return `a sheet name cannot hold \\ / ? * [ ] : ("${name}")`;
  if (name.startsWith("'") || name.endsWith("'"))
    return `a sheet name cannot begin or end with an apostrophe ("${name}")`;
  return undefined;
}

export class FakeSheet {
  readonly cells = new Map<string, Cell>();
  readonly charts: FakeChart[] = [];
  readonly changeHandlers: ((event: ChangeEvent) => Promise<void>)[] = [];
  readonly calculatedHandlers: ((event: CalculatedEvent) => Promise<void>)[] = [];
  /** The sheet's own selection, which becomes the workbook's when the sheet is activated. */
  selection = "A1";

  constructor(
    public name: string,
    readonly id: string,
  ) {}

  get(r: number, c: number): Cell {
    return this.cells.get(`${r},${c}`) ?? { value: "", formula: "" };
  }

  set(r: number, c: number, cell: Cell): void {
    if (cell.value === "" && cell.formula === "") this.cells.delete(`${r},${c}`);
    else this.cells.set(`${r},${c}`, cell);
  }

  /** Writes values from A1-style `address` onward, as a user typing them would. */
  fill(address: string, values: readonly (readonly unknown[])[]): void {
    const { r0, c0 } = parseArea(address);
    values.forEach((row, i) =>
      row.forEach((v, j) =>
        this.set(r0 + i, c0 + j, {
          value: v,
          formula: typeof v === "string" && v.startsWith("=") ? v : "",
        }),
      ),
    );
  }

  /** A formula cell with the value the host computed for it (an error value, say). */
  setFormula(address: string, formula: string, value: unknown): void {
    const { r0, c0 } = parseArea(address);
    this.set(r0, c0, { value, formula });
  }

  usedArea(): Area | null {
    let area: Area | null = null;
    for (const key of this.cells.keys()) {
      const [r, c] = key.split(",").map(Number) as [number, number];
      area =
        area === null
          ? { r0: r, c0: c, r1: r, c1: c }
          : {
              r0: Math.min(area.r0, r),
              c0: Math.min(area.c0, c),
              r1: Math.max(area.r1, r),
              c1: Math.max(area.c1, c),
            };
    }
    return area;
  }

  /** The formulas and values as a grid over `address`, for assertions. */
  grid(address: string): { values: unknown[][]; formulas: string[][] } {
    const { r0, c0, r1, c1 } = parseArea(address);
    const values: unknown[][] = [];
    const formulas: string[][] = [];
    for (let r = r0; r <= r1; r++) {
      const vr: unknown[] = [];
      const fr: string[] = [];
      for (let c = c0; c <= c1; c++) {
        const cell = this.get(r, c);
        vr.push(cell.value);
        fr.push(cell.formula);
      }
      values.push(vr);
      formulas.push(fr);
    }
    return { values, formulas };
  }
}

class FakeFill {
  colour: string | undefined;
  cleared = false;
  setSolidColor(colour: string): void {
    this.colour = colour;
  }
  clear(): void {
    this.cleared = true;
  }
}

class FakeLineFormat {
  lineStyle: string | undefined;
}

class FakeSeriesFormat {
  readonly fill = new FakeFill();
  readonly line = new FakeLineFormat();
}

export class FakeSeries {
  valuesAddress: string | undefined;
  xValuesAddress: string | undefined;
  chartType: string | undefined;
  markerStyle: string | undefined;
  markerSize: number | undefined;
  markerBackgroundColor: string | undefined;
  markerForegroundColor: string | undefined;
  readonly format = new FakeSeriesFormat();

  constructor(public name: string) {}

  setValues(range: FakeRange): void {
    this.valuesAddress = range.localAddress();
  }

  setXAxisValues(range: FakeRange): void {
    this.xValuesAddress = range.localAddress();
  }
}

class FakeTitle {
  text = "";
}

class FakeLegend {
  position = "";
}

class FakeAxisTitle {
  text = "";
}

class FakeAxis {
  readonly title = new FakeAxisTitle();
}

class FakeAxes {
  readonly valueAxis = new FakeAxis();
  readonly categoryAxis = new FakeAxis();
}

class FakeSeriesCollection {
  constructor(private readonly chart: FakeChart) {}
  getItemAt(i: number): FakeSeries {
    const s = this.chart.seriesList[i];
    if (s === undefined) throw new Error(`fake host: chart has no series ${i}`);
    return s;
  }
  add(name: string): FakeSeries {
    const s = new FakeSeries(name);
    this.chart.seriesList.push(s);
    return s;
  }
}

export class FakeChart {
  readonly title = new FakeTitle();
  readonly legend = new FakeLegend();
  readonly axes = new FakeAxes();
  position: [string, string] | undefined;
  readonly seriesList: FakeSeries[] = [];
  readonly series = new FakeSeriesCollection(this);

  constructor(
    readonly type: string,
    readonly sourceAddress: string,
    readonly seriesBy: string,
  ) {
    const area = parseArea(sourceAddress);
    for (let c = area.c0; c <= area.c1; c++) {
      const s = new FakeSeries("");
      s.valuesAddress = a1({ r0: area.r0 + 1, c0: c, r1: area.r1, c1: c });
      this.seriesList.push(s);
    }
  }

  /** At sync: each column's first cell names its series, as the host reads the source then. */
  nameSeries(sheet: FakeSheet): void {
    const area = parseArea(this.sourceAddress);
    for (let c = area.c0; c <= area.c1; c++) {
      const s = this.seriesList[c - area.c0];
      if (s !== undefined) s.name = String(sheet.get(area.r0, c).value);
    }
  }

  setPosition(from: string, to: string): void {
    this.position = [from, to];
  }
}

/** The Excel type name each fake class stands for, for the record of members used. */
const TYPE_NAMES = new Map<unknown, string>([
  [FakeFill, "ChartFill"],
  [FakeLineFormat, "ChartLineFormat"],
  [FakeSeriesFormat, "ChartSeriesFormat"],
  [FakeSeries, "ChartSeries"],
  [FakeTitle, "ChartTitle"],
  [FakeAxisTitle, "ChartAxisTitle"],
  [FakeLegend, "ChartLegend"],
  [FakeAxis, "ChartAxis"],
  [FakeAxes, "ChartAxes"],
  [FakeSeriesCollection, "ChartSeriesCollection"],
  [FakeChart, "Chart"],
]);

/** The fake behind each recording proxy, so fakes hand each other their real selves. */
const TARGETS = new WeakMap<object, object>();

function untracked(value: unknown): unknown {
  return typeof value === "object" && value !== null ? (TARGETS.get(value) ?? value) : value;
}

/** Wraps a fake object so every member read, written or called is recorded in `used`. */
function tracked<T>(value: T, used: Set<string>): T {
  if (typeof value !== "object" || value === null) return value;
  const type = TYPE_NAMES.get((value as object).constructor);
  if (type === undefined) return value;
  const proxy = new Proxy(value as object, {
    get(target, property) {
      const member = Reflect.get(target, property, target) as unknown;
      if (typeof property !== "string") return member;
      used.add(`${type}.${property}`);
      if (typeof member === "function") {
        return (...args: unknown[]) =>
          tracked(
            (member as (...a: unknown[]) => unknown).apply(target, args.map(untracked)),
            used,
          );
      }
      return tracked(member, used);
    },
    set(target, property, value) {
      if (typeof property === "string") used.add(`${type}.${property}`);
      return Reflect.set(target, property, value, target);
    },
  });
  TARGETS.set(proxy, value as object);
  return proxy as T;
}

/** One step queued in a context, carried out (or failed) by its next `sync`. */
type Pending = () => void;

export class FakeContext {
  readonly pending: Pending[] = [];
  readonly workbook: FakeWorkbookProxy;
  /** Inside an `Excel.run` that uses this context; a sync outside one is refused. */
  active = false;
  /** Cells loaded and bytes written by the steps queued since the last sync. */
  responseCells = 0;
  responseBytes = 0;
  requestBytes = 0;
  private failure: FakeRequestError | undefined;

  constructor(readonly host: FakeExcel) {
    this.workbook = tracked(new FakeWorkbookProxy(this), host.used);
  }

  /** Makes the next sync fail with `error` (a failure found while queuing, as the host would). */
  fail(error: FakeRequestError): void {
    this.failure ??= error;
  }

  async sync(): Promise<void> {
    if (!this.active) {
      throw new Error(
        "fake host: sync() on a request context whose Excel.run has ended; use Excel.run(context, batch) to reuse it",
      );
    }
    this.host.syncs++;
    // The host answers asynchronously; anything queued before this point belongs to this batch.
    await Promise.resolve();
    const pending = this.pending.splice(0);
    const armed = this.host.takeSyncFailure();
    const failure = this.failure ?? armed ?? this.limitFailure();
    this.failure = undefined;
    this.responseCells = 0;
    this.responseBytes = 0;
    this.requestBytes = 0;
    if (failure !== undefined) throw failure;
    for (const step of pending) step();
    this.host.flushWrites();
  }

  /** The documented request limits (learn: "Resource limits…", "Excel add-ins"). */
  private limitFailure(): FakeRequestError | undefined {
    if (this.responseCells > 5_000_000) {
      return new FakeRequestError(
        "RangeExceedsLimit",
        "The cell count in the range has exceeded the maximum supported number.",
      );
    }
    if (this.responseBytes > 5 * 1024 * 1024) {
      return new FakeRequestError(
        "ResponsePayloadSizeLimitExceeded",
        "The response payload size has exceeded the limit.",
      );
    }
    if (this.requestBytes > 5 * 1024 * 1024) {
      return new FakeRequestError(
        "RequestPayloadSizeLimitExceeded",
        "The request payload size has exceeded the limit.",
      );
    }
    return undefined;
  }
}

class NotLoadedError extends Error {
  constructor(property: string) {
    super(`fake host: the property "${property}" was read before load() and sync()`);
  }
}

class FakeFont {
  bold = false;
}

class FakeRangeFormat {
  readonly font = new FakeFont();
}

export class FakeRange {
  private readonly loaded = new Map<string, unknown>();
  readonly format = new FakeRangeFormat();

  constructor(
    private readonly context: FakeContext,
    readonly sheet: FakeSheet,
    readonly area: Area | null,
    /** A failure this range's requests meet at sync (a multi-area selection, say). */
    private readonly failure?: FakeRequestError,
  ) {}

  private read(property: string): unknown {
    if (!this.loaded.has(property)) throw new NotLoadedError(property);
    return this.loaded.get(property);
  }

  private snapshot(property: string): unknown {
    const area = this.area;
    if (area === null) return undefined;
    switch (property) {
      case "address":
        return `${sheetPrefix(this.sheet.name)}!${a1(area)}`;
      case "rowIndex":
        return area.r0;
      case "columnIndex":
        return area.c0;
      case "rowCount":
        return area.r1 - area.r0 + 1;
      case "columnCount":
        return area.c1 - area.c0 + 1;
      case "values":
      case "valueTypes":
      case "formulas": {
        const grid = this.sheet.grid(a1(area));
        this.context.host.loads.push({
          address: a1(area),
          property,
          cells: grid.values.length * (grid.values[0]?.length ?? 0),
        });
        if (property === "values") return grid.values.map((row) => row.map(shownValue));
        if (property === "valueTypes") return grid.values.map((row) => row.map(valueType));
        return grid.formulas.map((row, i) =>
          row.map((f, j) => (f !== "" ? f : shownValue(grid.values[i]?.[j]))),
        );
      }
      default:
        throw new Error(`fake host: unsupported property ${property}`);
    }
  }

  /** About the bytes the host would send for these properties of `area`, as JSON. */
  private responseSize(area: Area, properties: readonly string[]): number {
    let bytes = 0;
    for (let r = area.r0; r <= area.r1; r++) {
      for (let c = area.c0; c <= area.c1; c++) {
        const cell = this.sheet.get(r, c);
        for (const p of properties) {
          const shown = p === "valueTypes" ? valueType(cell.value) : shownValue(cell.value);
          const text = p === "formulas" && cell.formula !== "" ? cell.formula : shown;
          bytes += (typeof text === "string" ? text.length + 2 : String(text).length) + 1;
        }
      }
    }
    return bytes;
  }

  load(properties: string | string[]): this {
    const list =
      typeof properties === "string" ? properties.split(",").map((p) => p.trim()) : properties;
    if (this.failure !== undefined) this.context.fail(this.failure);
    const cellData = list.filter((p) => p === "values" || p === "valueTypes" || p === "formulas");
    const area = this.area;
    if (area !== null && cellData.length > 0) {
      // The response's size, as the host would serialise it, counts against its limits.
      this.context.responseCells += (area.r1 - area.r0 + 1) * (area.c1 - area.c0 + 1);
      this.context.responseBytes += this.responseSize(area, cellData);
    }
    this.context.pending.push(() => {
      this.loaded.set("isNullObject", this.area === null);
      for (const p of list) this.loaded.set(p, this.snapshot(p));
    });
    return this;
  }

  get isNullObject(): boolean {
    return this.read("isNullObject") as boolean;
  }
  get address(): string {
    return this.read("address") as string;
  }
  get rowIndex(): number {
    return this.read("rowIndex") as number;
  }
  get columnIndex(): number {
    return this.read("columnIndex") as number;
  }
  get rowCount(): number {
    return this.read("rowCount") as number;
  }
  get columnCount(): number {
    return this.read("columnCount") as number;
  }
  get values(): unknown[][] {
    return this.read("values") as unknown[][];
  }
  set values(grid: unknown[][]) {
    this.write(grid, false);
  }
  get valueTypes(): string[][] {
    return this.read("valueTypes") as string[][];
  }
  get formulas(): unknown[][] {
    return this.read("formulas") as unknown[][];
  }
  set formulas(grid: unknown[][]) {
    this.write(grid, true);
  }

  /** A write is sent with the next sync and fires the sheet's change event after it. */
  private write(grid: unknown[][], asFormulas: boolean): void {
    const area = this.requireArea();
    this.context.requestBytes += JSON.stringify(grid).length;
    const host = this.context.host;
    this.context.pending.push(() => {
      grid.forEach((row, i) =>
        row.forEach((v, j) => {
          const r = area.r0 + i;
          const c = area.c0 + j;
          const before = this.sheet.get(r, c);
          const isFormula = asFormulas && typeof v === "string" && v.startsWith("=");
          host.writes.push({
            sheet: this.sheet.name,
            address: a1({ r0: r, c0: c, r1: r, c1: c }),
            content: v,
            kind: isFormula ? "formula" : "value",
            overwrote: before.value !== "" || before.formula !== "",
          });
          this.sheet.set(r, c, isFormula ? { value: "", formula: v } : { value: v, formula: "" });
        }),
      );
      host.noteWrite(this.sheet, {
        r0: area.r0,
        c0: area.c0,
        r1: area.r0 + grid.length - 1,
        c1: area.c0 + (grid[0]?.length ?? 1) - 1,
      });
    });
  }

  private requireArea(): Area {
    if (this.area === null) throw new Error("fake host: a null range was used");
    return this.area;
  }

  localAddress(): string {
    return a1(this.requireArea());
  }

  get worksheet(): FakeWorksheetProxy {
    return new FakeWorksheetProxy(this.context, this.sheet);
  }

  getCell(row: number, column: number): FakeRange {
    const a = this.requireArea();
    return new FakeRange(this.context, this.sheet, {
      r0: a.r0 + row,
      c0: a.c0 + column,
      r1: a.r0 + row,
      c1: a.c0 + column,
    });
  }

  getResizedRange(deltaRows: number, deltaColumns: number): FakeRange {
    const a = this.requireArea();
    return new FakeRange(this.context, this.sheet, {
      ...a,
      r1: a.r1 + deltaRows,
      c1: a.c1 + deltaColumns,
    });
  }

  getIntersectionOrNullObject(other: FakeRange): FakeRange {
    const a = this.area;
    const b = other.area;
    if (a === null || b === null)
      return new FakeRange(this.context, this.sheet, null, this.failure);
    const area = {
      r0: Math.max(a.r0, b.r0),
      c0: Math.max(a.c0, b.c0),
      r1: Math.min(a.r1, b.r1),
      c1: Math.min(a.c1, b.c1),
    };
    const empty = area.r0 > area.r1 || area.c0 > area.c1;
    return new FakeRange(this.context, this.sheet, empty ? null : area, this.failure);
  }
}

/** The selection's areas (ExcelApi 1.9): how many there are, and their address. */
export class FakeRangeAreas {
  private loaded = false;
  constructor(
    private readonly context: FakeContext,
    private readonly sheet: FakeSheet,
    private readonly range: string,
  ) {}
  load(_properties: string | string[]): this {
    this.context.pending.push(() => {
      this.loaded = true;
    });
    return this;
  }
  get areaCount(): number {
    if (!this.loaded) throw new NotLoadedError("areaCount");
    return this.range.split(",").length;
  }
  get address(): string {
    if (!this.loaded) throw new NotLoadedError("address");
    return this.range
      .split(",")
      .map((part) => `${sheetPrefix(this.sheet.name)}!${part.trim()}`)
      .join(",");
  }
}

export class FakeEventHandlers<E> {
  constructor(
    private readonly context: FakeContext,
    private readonly list: ((event: E) => Promise<void>)[],
  ) {}

  add(handler: (event: E) => Promise<void>) {
    this.list.push(handler);
    const list = this.list;
    const context = this.context;
    return {
      context,
      /** Queued in the handler's own context; takes effect when that context syncs. */
      remove() {
        context.pending.push(() => {
          const i = list.indexOf(handler);
          if (i >= 0) list.splice(i, 1);
        });
      },
    };
  }
}

export class FakeWorksheetProxy {
  constructor(
    private readonly context: FakeContext,
    readonly sheet: FakeSheet,
  ) {}

  get name(): string {
    return this.sheet.name;
  }
  get onChanged() {
    return new FakeEventHandlers<ChangeEvent>(this.context, this.sheet.changeHandlers);
  }
  get onCalculated() {
    return new FakeEventHandlers<CalculatedEvent>(this.context, this.sheet.calculatedHandlers);
  }
  get charts() {
    const used = this.context.host.used;
    return {
      add: (type: string, source: FakeRange, seriesBy: string) => {
        used.add("ChartCollection.add");
        const chart = new FakeChart(
          type,
          (untracked(source) as FakeRange).localAddress(),
          seriesBy,
        );
        this.context.pending.push(() => {
          chart.nameSeries(this.sheet);
          this.sheet.charts.push(chart);
        });
        return tracked(chart, used);
      },
    };
  }
  getRange(address: string): FakeRange {
    return new FakeRange(this.context, this.sheet, parseArea(address));
  }
  getRangeByIndexes(row: number, column: number, rows: number, columns: number): FakeRange {
    return new FakeRange(this.context, this.sheet, {
      r0: row,
      c0: column,
      r1: row + rows - 1,
      c1: column + columns - 1,
    });
  }
  getUsedRangeOrNullObject(): FakeRange {
    return new FakeRange(this.context, this.sheet, this.sheet.usedArea());
  }
  /** Activating a sheet makes its selection the workbook's, so the selection event fires. */
  activate(): void {
    const host = this.context.host;
    this.context.pending.push(() => host.activate(this.sheet));
  }
}

export class FakeWorksheetCollection {
  private items_: FakeWorksheetProxy[] | undefined;
  constructor(private readonly context: FakeContext) {}

  load(_what: string): void {
    const host = this.context.host;
    this.context.pending.push(() => {
      this.items_ = host.sheets.map((s) =>
        tracked(new FakeWorksheetProxy(this.context, s), host.used),
      );
    });
  }
  get items(): FakeWorksheetProxy[] {
    if (this.items_ === undefined) throw new NotLoadedError("items");
    return this.items_;
  }
  /** Fails at once for a name the host refuses (the sheet-name rules above). */
  add(name: string): FakeWorksheetProxy {
    const host = this.context.host;
    const problem =
      sheetNameProblem(name) === undefined
        ? host.sheets.some((s) => s.name.toLowerCase() === name.toLowerCase())
          ? new FakeRequestError("ItemAlreadyExists", `a sheet named "${name}" already exists`)
          : undefined
        : new FakeRequestError("InvalidArgument", sheetNameProblem(name) as string);
    if (problem !== undefined) {
      this.context.fail(problem);
      return new FakeWorksheetProxy(this.context, new FakeSheet(name, ""));
    }
    const sheet = host.addSheet(name);
    host.onSheetAdded?.(sheet);
    return new FakeWorksheetProxy(this.context, sheet);
  }
  getItem(name: string): FakeWorksheetProxy {
    return new FakeWorksheetProxy(this.context, this.context.host.sheet(name));
  }
  getActiveWorksheet(): FakeWorksheetProxy {
    const host = this.context.host;
    return new FakeWorksheetProxy(this.context, host.sheet(host.activeSheet));
  }
}

class FakeWorkbookProxy {
  constructor(private readonly context: FakeContext) {}

  get onSelectionChanged() {
    return new FakeEventHandlers<unknown>(this.context, this.context.host.selectionHandlers);
  }

  getSelectedRange(): FakeRange {
    const { sheet, range } = this.context.host.selection;
    const target = this.context.host.sheet(sheet);
    if (range.includes(",")) {
      return new FakeRange(
        this.context,
        target,
        parseArea(range.split(",")[0] as string),
        new FakeRequestError(
          "InvalidSelection",
          "The current selection is invalid for this operation.",
        ),
      );
    }
    return new FakeRange(this.context, target, parseArea(range));
  }

  /** ExcelApi 1.9: on an older host the member does not exist. */
  getSelectedRanges(): FakeRangeAreas {
    const host = this.context.host;
    if (!host.supports("1.9")) {
      throw new TypeError("context.workbook.getSelectedRanges is not a function");
    }
    const { sheet, range } = host.selection;
    return new FakeRangeAreas(this.context, host.sheet(sheet), range);
  }

  get worksheets(): FakeWorksheetCollection {
    return new FakeWorksheetCollection(this.context);
  }
}

TYPE_NAMES.set(FakeRange, "Range");
TYPE_NAMES.set(FakeRangeFormat, "RangeFormat");
TYPE_NAMES.set(FakeFont, "RangeFont");
TYPE_NAMES.set(FakeRangeAreas, "RangeAreas");
TYPE_NAMES.set(FakeWorksheetProxy, "Worksheet");
TYPE_NAMES.set(FakeWorksheetCollection, "WorksheetCollection");
TYPE_NAMES.set(FakeWorkbookProxy, "Workbook");

export interface WriteRecord {
  readonly sheet: string;
  readonly address: string;
  readonly content: unknown;
  readonly kind: "formula" | "value";
  readonly overwrote: boolean;
}

export type VisibilityMode = "Taskpane" | "Hidden";

function changeEvent(
  sheet: FakeSheet,
  area: Area,
  triggerSource: ChangeEvent["triggerSource"],
): ChangeEvent {
  return {
    address: a1(area),
    worksheetId: sheet.id,
    type: "WorksheetChanged",
    changeType: "RangeEdited",
    source: "Local",
    triggerSource,
  };
}

function compareVersions(a: string, b: string): number {
  const [am = 0, an = 0] = a.split(".").map(Number);
  const [bm = 0, bn = 0] = b.split(".").map(Number);
  return am !== bm ? am - bm : an - bn;
}

/** The fake workbook and its test controls. */
export class FakeExcel {
  readonly sheets: FakeSheet[] = [];
  readonly selectionHandlers: ((event: unknown) => Promise<void>)[] = [];
  readonly visibilityHandlers: ((message: { visibilityMode: VisibilityMode }) => void)[] = [];
  readonly writes: WriteRecord[] = [];
  readonly loads: { address: string; property: string; cells: number }[] = [];
  /** Every API member the glue touched, as "Type.member". */
  readonly used = new Set<string>();
  selection = { sheet: "", range: "A1" };
  activeSheet = "";
  syncs = 0;
  /** The highest ExcelApi requirement set this host supports. */
  apiVersion = "1.17";
  /** Runs on every sheet the pane adds, before it returns: lets a test put data there. */
  onSheetAdded: ((sheet: FakeSheet) => void) | undefined;
  private nextId = 1;
  private syncFailures: FakeRequestError[] = [];
  private inFlight: Promise<void>[] = [];
  private written = new Map<FakeSheet, Area[]>();

  constructor(firstSheet = "Sheet1") {
    this.addSheet(firstSheet);
    this.selection = { sheet: firstSheet, range: "A1" };
    this.activeSheet = firstSheet;
  }

  addSheet(name: string): FakeSheet {
    const sheet = new FakeSheet(name, `{sheet-${this.nextId++}}`);
    this.sheets.push(sheet);
    return sheet;
  }

  sheet(name: string): FakeSheet {
    const found = this.sheets.find((s) => s.name === name);
    if (found === undefined) {
      throw new FakeRequestError("ItemNotFound", `fake host: no sheet named "${name}"`);
    }
    return found;
  }

  /** `Office.context.requirements.isSetSupported("ExcelApi", version)`. */
  readonly supports: ApiSupport = (version) => compareVersions(version, this.apiVersion) <= 0;

  /** The next sync of any context fails with this error (the whole batch with it). */
  failNextSync(code = "GeneralException", message = "There was an internal error."): void {
    this.syncFailures.push(new FakeRequestError(code, message));
  }

  takeSyncFailure(): FakeRequestError | undefined {
    return this.syncFailures.shift();
  }

  /**
   * `Excel.run(batch)` over this workbook: a fresh context and a final sync, as the host does;
   * `Excel.run(context, batch)` reuses an earlier context for the batch.
   */
  readonly run: ExcelRun = (async <T>(
    first: unknown,
    second?: (context: Excel.RequestContext) => Promise<T>,
  ): Promise<T> => {
    const reuse = typeof first !== "function";
    const context = reuse ? (first as FakeContext) : new FakeContext(this);
    const batch = (reuse ? second : first) as (context: Excel.RequestContext) => Promise<T>;
    if (!(context instanceof FakeContext)) throw new Error("fake host: not a request context");
    const wasActive = context.active;
    context.active = true;
    try {
      const result = await batch(context as unknown as Excel.RequestContext);
      await context.sync();
      return result;
    } finally {
      context.active = wasActive;
    }
  }) as ExcelRun;

  /** `Office.addin` as the page sees it: visibility changes. */
  readonly addin = {
    onVisibilityModeChanged: async (
      handler: (message: { visibilityMode: VisibilityMode }) => void,
    ): Promise<() => Promise<void>> => {
      this.visibilityHandlers.push(handler);
      return async () => {
        const i = this.visibilityHandlers.indexOf(handler);
        if (i >= 0) this.visibilityHandlers.splice(i, 1);
      };
    },
  };

  /** Shows or hides the task pane, as the user closing or reopening it does. */
  async setVisibility(mode: VisibilityMode): Promise<void> {
    for (const handler of [...this.visibilityHandlers]) handler({ visibilityMode: mode });
    await this.settle();
  }

  /** Runs `fire` after the current batch, as the host delivers events. */
  private dispatch(fire: () => Promise<void>): void {
    this.inFlight.push(new Promise<void>((ready) => setTimeout(ready, 0)).then(fire));
  }

  /** Waits until every event fired so far (and any they caused) has been handled. */
  async settle(): Promise<void> {
    while (this.inFlight.length > 0) {
      const batch = this.inFlight.splice(0);
      await Promise.all(batch);
    }
  }

  /** Called by a sync that carried an activation: the sheet's selection becomes the workbook's. */
  activate(sheet: FakeSheet): void {
    const before = this.selection;
    this.activeSheet = sheet.name;
    this.selection = { sheet: sheet.name, range: sheet.selection };
    if (before.sheet !== sheet.name || before.range !== sheet.selection) {
      this.dispatch(() => this.fireSelection());
    }
  }

  noteWrite(sheet: FakeSheet, area: Area): void {
    const list = this.written.get(sheet) ?? [];
    list.push(area);
    this.written.set(sheet, list);
  }

  /** After a sync: each sheet written fires its change handlers, naming this add-in. */
  flushWrites(): void {
    for (const [sheet, areas] of this.written) {
      for (const area of areas) {
        const event = changeEvent(sheet, area, "ThisLocalAddin");
        this.dispatch(async () => {
          for (const handler of [...sheet.changeHandlers]) await handler(event);
        });
      }
    }
    this.written.clear();
  }

  private async fireSelection(): Promise<void> {
    for (const handler of [...this.selectionHandlers])
      await handler({ type: "WorkbookSelectionChanged" });
  }

  /** Selects a range (several areas: "A1:A9,C1:C9") and fires the selection handlers. */
  async select(sheet: string, range: string): Promise<void> {
    this.selection = { sheet, range };
    this.activeSheet = sheet;
    this.sheet(sheet).selection = range;
    await this.fireSelection();
    await this.settle();
  }

  /** Edits cells as a user would and fires the sheet's change handlers. */
  async edit(
    sheetName: string,
    address: string,
    values: readonly (readonly unknown[])[],
  ): Promise<void> {
    const sheet = this.sheet(sheetName);
    sheet.fill(address, values);
    const { r0, c0 } = parseArea(address);
    const area = { r0, c0, r1: r0 + values.length - 1, c1: c0 + (values[0]?.length ?? 1) - 1 };
    const event = changeEvent(sheet, area, "Unknown");
    for (const handler of [...sheet.changeHandlers]) await handler(event);
    await this.settle();
  }

  /**
   * Stands for a recalculation: formula cells of the sheet take new values (no edit event, as
   * when a model's inputs change elsewhere) and the sheet's calculated handlers fire.
   */
  async recalculate(
    sheetName: string,
    address?: string,
    values?: readonly (readonly unknown[])[],
  ): Promise<void> {
    const sheet = this.sheet(sheetName);
    if (address !== undefined && values !== undefined) sheet.fill(address, values);
    const event: CalculatedEvent = { worksheetId: sheet.id, type: "WorksheetCalculated" };
    for (const handler of [...sheet.calculatedHandlers]) await handler(event);
    await this.settle();
  }
}

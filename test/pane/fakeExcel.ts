/**
 * An in-memory stand-in for the slice of the spreadsheet host's API the pane uses (an equivalent
 * of office-addin-mock with a real cell grid): worksheets, ranges by address and by indexes, used
 * ranges and intersections, values and formulas, charts with series, and the selection and
 * change events. Like the host, a property can be read only after `load` and `sync`, so the glue
 * under test cannot skip a load it would need in a real workbook.
 */
import type { ExcelRun } from "../../taskpane/host/excel";

interface Area {
  r0: number;
  c0: number;
  r1: number;
  c1: number;
}

interface Cell {
  value: unknown;
  formula: string;
}

export interface ChangeEvent {
  address: string;
  worksheetId: string;
  type: "WorksheetChanged";
  changeType: "RangeEdited";
}

export interface CalculatedEvent {
  worksheetId: string;
  type: "WorksheetCalculated";
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

function parseCell(text: string): { r: number; c: number } {
  const m = /^\$?([A-Z]+)\$?(\d+)$/.exec(text.trim().toUpperCase());
  if (m === null) throw new Error(`fake host: unsupported address "${text}"`);
  let c = 0;
  for (const ch of m[1] as string) c = c * 26 + ch.charCodeAt(0) - 64;
  return { r: Number(m[2]) - 1, c: c - 1 };
}

export function parseArea(address: string): Area {
  const [from, to = from] = address.split(":") as [string, string?];
  const a = parseCell(from);
  const b = parseCell(to);
  return {
    r0: Math.min(a.r, b.r),
    c0: Math.min(a.c, b.c),
    r1: Math.max(a.r, b.r),
    c1: Math.max(a.c, b.c),
  };
}

function sheetPrefix(name: string): string {
  return /^[A-Za-z0-9_]+$/.test(name) ? name : `'${name.replace(/'/g, "''")}'`;
}

export class FakeSheet {
  readonly cells = new Map<string, Cell>();
  readonly charts: FakeChart[] = [];
  readonly changeHandlers: ((event: ChangeEvent) => Promise<void>)[] = [];
  readonly calculatedHandlers: ((event: CalculatedEvent) => Promise<void>)[] = [];

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

export class FakeSeries {
  valuesAddress: string | undefined;
  xValuesAddress: string | undefined;
  chartType: string | undefined;
  markerStyle: string | undefined;
  markerSize: number | undefined;
  markerBackgroundColor: string | undefined;
  markerForegroundColor: string | undefined;
  readonly format = {
    fill: {
      colour: undefined as string | undefined,
      cleared: false,
      setSolidColor(colour: string) {
        this.colour = colour;
      },
      clear() {
        this.cleared = true;
      },
    },
    line: { lineStyle: undefined as string | undefined },
  };

  constructor(public name: string) {}

  setValues(range: FakeRange): void {
    this.valuesAddress = range.localAddress();
  }

  setXAxisValues(range: FakeRange): void {
    this.xValuesAddress = range.localAddress();
  }
}

export class FakeChart {
  readonly title = { text: "" };
  readonly legend = { position: "" };
  readonly axes = { valueAxis: { title: { text: "" } }, categoryAxis: { title: { text: "" } } };
  position: [string, string] | undefined;
  readonly seriesList: FakeSeries[] = [];
  readonly series = {
    getItemAt: (i: number) => {
      const s = this.seriesList[i];
      if (s === undefined) throw new Error(`fake host: chart has no series ${i}`);
      return s;
    },
    add: (name: string) => {
      const s = new FakeSeries(name);
      this.seriesList.push(s);
      return s;
    },
  };

  constructor(
    readonly type: string,
    readonly sourceAddress: string,
    readonly seriesBy: string,
    sheet: FakeSheet,
  ) {
    const area = parseArea(sourceAddress);
    for (let c = area.c0; c <= area.c1; c++) {
      const s = new FakeSeries(String(sheet.get(area.r0, c).value));
      s.valuesAddress = a1({ r0: area.r0 + 1, c0: c, r1: area.r1, c1: c });
      this.seriesList.push(s);
    }
  }

  setPosition(from: string, to: string): void {
    this.position = [from, to];
  }
}

/** What one context has asked to load and not yet synced. */
type Pending = () => void;

export class FakeContext {
  readonly pending: Pending[] = [];
  readonly workbook: FakeWorkbookProxy;

  constructor(readonly host: FakeExcel) {
    this.workbook = new FakeWorkbookProxy(this);
  }

  async sync(): Promise<void> {
    this.host.syncs++;
    const pending = this.pending.splice(0);
    for (const resolve of pending) resolve();
  }
}

class NotLoadedError extends Error {
  constructor(property: string) {
    super(`fake host: the property "${property}" was read before load() and sync()`);
  }
}

export class FakeRange {
  private readonly loaded = new Map<string, unknown>();
  readonly format = { font: { bold: false } };

  constructor(
    private readonly context: FakeContext,
    readonly sheet: FakeSheet,
    readonly area: Area | null,
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
      case "rowCount":
        return area.r1 - area.r0 + 1;
      case "columnCount":
        return area.c1 - area.c0 + 1;
      case "values":
      case "formulas": {
        const grid = this.sheet.grid(a1(area));
        this.context.host.loads.push({
          address: a1(area),
          cells: grid.values.length * (grid.values[0]?.length ?? 0),
        });
        return property === "values"
          ? grid.values
          : grid.formulas.map((row, i) => row.map((f, j) => (f !== "" ? f : grid.values[i]?.[j])));
      }
      default:
        throw new Error(`fake host: unsupported property ${property}`);
    }
  }

  load(properties: string | string[]): this {
    const list =
      typeof properties === "string" ? properties.split(",").map((p) => p.trim()) : properties;
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
  get formulas(): unknown[][] {
    return this.read("formulas") as unknown[][];
  }
  set formulas(grid: unknown[][]) {
    this.write(grid, true);
  }

  private write(grid: unknown[][], asFormulas: boolean): void {
    const area = this.requireArea();
    grid.forEach((row, i) =>
      row.forEach((v, j) => {
        const r = area.r0 + i;
        const c = area.c0 + j;
        const before = this.sheet.get(r, c);
        const isFormula = asFormulas && typeof v === "string" && v.startsWith("=");
        this.context.host.writes.push({
          sheet: this.sheet.name,
          address: a1({ r0: r, c0: c, r1: r, c1: c }),
          content: v,
          kind: isFormula ? "formula" : "value",
          overwrote: before.value !== "" || before.formula !== "",
        });
        this.sheet.set(r, c, isFormula ? { value: "", formula: v } : { value: v, formula: "" });
      }),
    );
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
    if (a === null || b === null) return new FakeRange(this.context, this.sheet, null);
    const area = {
      r0: Math.max(a.r0, b.r0),
      c0: Math.max(a.c0, b.c0),
      r1: Math.min(a.r1, b.r1),
      c1: Math.min(a.c1, b.c1),
    };
    const empty = area.r0 > area.r1 || area.c0 > area.c1;
    return new FakeRange(this.context, this.sheet, empty ? null : area);
  }
}

class FakeEventHandlers<E> {
  constructor(
    private readonly context: FakeContext,
    private readonly list: ((event: E) => Promise<void>)[],
  ) {}

  add(handler: (event: E) => Promise<void>) {
    this.list.push(handler);
    const list = this.list;
    return {
      context: this.context,
      remove() {
        const i = list.indexOf(handler);
        if (i >= 0) list.splice(i, 1);
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
    return {
      add: (type: string, source: FakeRange, seriesBy: string) => {
        const chart = new FakeChart(type, source.localAddress(), seriesBy, this.sheet);
        this.sheet.charts.push(chart);
        return chart;
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
  activate(): void {
    this.context.host.activeSheet = this.sheet.name;
  }
}

class FakeWorkbookProxy {
  constructor(private readonly context: FakeContext) {}

  get onSelectionChanged() {
    return new FakeEventHandlers<unknown>(this.context, this.context.host.selectionHandlers);
  }

  getSelectedRange(): FakeRange {
    const { sheet, range } = this.context.host.selection;
    return new FakeRange(this.context, this.context.host.sheet(sheet), parseArea(range));
  }

  get worksheets() {
    const host = this.context.host;
    const context = this.context;
    let items: FakeWorksheetProxy[] | undefined;
    return {
      load(_what: string) {
        context.pending.push(() => {
          items = host.sheets.map((s) => new FakeWorksheetProxy(context, s));
        });
      },
      get items(): FakeWorksheetProxy[] {
        if (items === undefined) throw new NotLoadedError("items");
        return items;
      },
      add(name: string) {
        if (host.sheets.some((s) => s.name.toLowerCase() === name.toLowerCase())) {
          throw new Error(`fake host: a sheet named "${name}" already exists`);
        }
        const sheet = host.addSheet(name);
        host.onSheetAdded?.(sheet);
        return new FakeWorksheetProxy(context, sheet);
      },
      getItem(name: string) {
        return new FakeWorksheetProxy(context, host.sheet(name));
      },
      getActiveWorksheet() {
        return new FakeWorksheetProxy(context, host.sheet(host.activeSheet));
      },
    };
  }
}

export interface WriteRecord {
  readonly sheet: string;
  readonly address: string;
  readonly content: unknown;
  readonly kind: "formula" | "value";
  readonly overwrote: boolean;
}

/** The fake workbook and its test controls. */
export class FakeExcel {
  readonly sheets: FakeSheet[] = [];
  readonly selectionHandlers: ((event: unknown) => Promise<void>)[] = [];
  readonly writes: WriteRecord[] = [];
  readonly loads: { address: string; cells: number }[] = [];
  selection = { sheet: "", range: "A1" };
  activeSheet = "";
  syncs = 0;
  /** Runs on every sheet the pane adds, before it returns: lets a test put data there. */
  onSheetAdded: ((sheet: FakeSheet) => void) | undefined;
  private nextId = 1;

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
    if (found === undefined) throw new Error(`fake host: no sheet named "${name}"`);
    return found;
  }

  /** `Excel.run` over this workbook: a fresh context, and a final sync as the host does. */
  readonly run: ExcelRun = async (batch) => {
    const context = new FakeContext(this);
    const result = await batch(context as unknown as Excel.RequestContext);
    await context.sync();
    return result;
  };

  /** Selects a range and fires the selection handlers, as a user clicking would. */
  async select(sheet: string, range: string): Promise<void> {
    this.selection = { sheet, range };
    for (const handler of [...this.selectionHandlers])
      await handler({ type: "WorkbookSelectionChanged" });
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
    const event: ChangeEvent = {
      address: a1(area),
      worksheetId: sheet.id,
      type: "WorksheetChanged",
      changeType: "RangeEdited",
    };
    for (const handler of [...sheet.changeHandlers]) await handler(event);
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
  }
}

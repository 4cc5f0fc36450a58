/**
 * Long format: one row per (item, period) — an id column, a time column and a value column, as
 * databases and planning systems export forecast errors — read into one series per id.
 *
 * - Rows may come in any order: they are grouped by id (ids keep the order they first appear in)
 *   and ordered by time within each id.
 * - Two rows with the same id and time are refused, naming both lines.
 * - Time is a date (dates.ts: ISO dates, `31.01.2024`, `2024-01`, `2024-W05`, yyyymmdd numbers)
 *   or a whole period number. The calendar is found from all ids together: monthly when every
 *   date falls on the same day of its month (or on its month's last day), otherwise days; the
 *   step is the greatest common divisor of the differences between consecutive times (1 day
 *   daily, 7 weekly, 1 month monthly). A period missing from an id's run becomes a gap at its
 *   place, so lags stay periods, never rows.
 * - A value cell is read by the text-cell rules; an id with a refused value cell is not analysed
 *   and says which cell. An empty line carries no id and is passed over.
 * Memory: four numbers a row (id index, time, value, line) in growable Float64Arrays, and the ids.
 */
import { calendarDate, dayNumber, isoDate, yyyymmddDay } from "./dates";
import { invalid } from "./errors";
import { formatNameList } from "./format";
import { GrowableNumbers } from "./growable";
import { seriesFromColumn } from "./intake";
import { cellRefusal, type Offender } from "./table";
import { cellReader, textCellHint, type CellRules, type OptionWords } from "./textCells";
import type { Series } from "./types";

export interface LongColumns {
  /** Each a header name or a column number counted from 1. */
  readonly id: string;
  readonly time: string;
  readonly value: string;
}

export interface LongOptions {
  readonly origin: string;
  readonly columns: LongColumns;
  readonly cells?: CellRules;
  readonly words: OptionWords;
}

export interface Calendar {
  /** What one step is: "day", "month" or "period". */
  readonly unit: "day" | "month" | "period";
  readonly step: number;
  /** Periods missing inside the ids' runs, read as gaps. */
  readonly filled: number;
}

export interface LongTable {
  /** One series per id that could be read, labelled by its id. */
  readonly series: readonly Series[];
  /** Ids that could not be read, with why. */
  readonly notAnalysed: readonly { readonly label: string; readonly reason: string }[];
  readonly calendar: Calendar;
  readonly rows: number;
  /** The header names of the three columns. */
  readonly names: LongColumns;
}

/** "monthly", "weekly", "every 2 days", … */
export function calendarName(calendar: Calendar): string {
  const { unit, step } = calendar;
  if (unit === "month")
    return step === 1 ? "monthly" : step === 3 ? "quarterly" : `every ${step} months`;
  if (unit === "day") return step === 1 ? "daily" : step === 7 ? "weekly" : `every ${step} days`;
  return step === 1 ? "consecutive periods" : `every ${step} periods`;
}

function resolveColumn(
  headers: readonly string[],
  choice: string,
  role: string,
  origin: string,
): number {
  const byName = headers.indexOf(choice);
  if (byName >= 0) return byName;
  if (/^\d+$/.test(choice)) {
    const index = Number(choice) - 1;
    if (index >= 0 && index < headers.length) return index;
  }
  invalid(
    `the ${role} column "${choice}" matches no column of ${origin}: give a name (${formatNameList(headers)}) or a number from 1 to ${headers.length}`,
  );
}

function gcd(a: number, b: number): number {
  while (b !== 0) [a, b] = [b, a % b];
  return Math.abs(a);
}

export class LongBuilder {
  private readonly reader;
  private columns: { id: number; time: number; value: number } | undefined;
  private names: LongColumns | undefined;
  private readonly idIndex = new Map<string, number>();
  private readonly ids: string[] = [];
  private readonly idOf = new GrowableNumbers();
  private readonly times = new GrowableNumbers();
  private readonly values = new GrowableNumbers();
  private readonly lines = new GrowableNumbers();
  private readonly offenders = new Map<number, Offender>();
  private timeKind: "date" | "number" | undefined;
  private width = 0;

  constructor(private readonly options: LongOptions) {
    this.reader = cellReader(options.cells ?? {});
  }

  push(record: readonly string[], line: number): void {
    if (this.columns === undefined) {
      const headers = record.map((h) => h.trim());
      const { id, time, value } = this.options.columns;
      const origin = this.options.origin;
      this.columns = {
        id: resolveColumn(headers, id, "id", origin),
        time: resolveColumn(headers, time, "time", origin),
        value: resolveColumn(headers, value, "value", origin),
      };
      const c = this.columns;
      if (c.id === c.time || c.id === c.value || c.time === c.value) {
        invalid("the id, time and value columns must be three different columns");
      }
      this.names = {
        id: headers[c.id] ?? "",
        time: headers[c.time] ?? "",
        value: headers[c.value] ?? "",
      };
      this.width = record.length;
      return;
    }
    if (record.length === 1 && (record[0] as string).trim() === "") return;
    if (record.length !== this.width) {
      invalid(
        `line ${line} of ${this.options.origin} has ${record.length} fields where the header has ${this.width}: every line needs the same number of fields`,
      );
    }
    const c = this.columns;
    const id = (record[c.id] as string).trim();
    if (id === "")
      invalid(
        `line ${line} of ${this.options.origin} has no id in column ${c.id + 1} ("${this.names?.id}")`,
      );
    let index = this.idIndex.get(id);
    if (index === undefined) {
      index = this.ids.length;
      this.idIndex.set(id, index);
      this.ids.push(id);
    }
    this.idOf.push(index);
    this.times.push(this.timeKey(record[c.time] as string, line));
    this.lines.push(line);
    const text = record[c.value] as string;
    const value = this.reader.read(text);
    if (value === undefined || (!Number.isFinite(value) && !Number.isNaN(value))) {
      if (!this.offenders.has(index)) this.offenders.set(index, { line, text });
      this.values.push(NaN);
    } else {
      this.values.push(value);
    }
  }

  private timeKey(text: string, line: number): number {
    const t = text.trim();
    const asNumber = this.reader.read(t);
    const kind = asNumber !== undefined && !Number.isNaN(asNumber) ? "number" : "date";
    const key = kind === "number" ? (asNumber as number) : dayNumber(t);
    const where = `line ${line}, column ${(this.columns?.time ?? 0) + 1} ("${this.names?.time}") of ${this.options.origin}`;
    if (key === undefined || !Number.isFinite(key)) {
      invalid(
        `${where} holds "${t}", which is not a time Echolot reads: write dates as 2024-01-31 (or 2024-01 for months, 2024-W05 for weeks), or periods as whole numbers`,
      );
    }
    if (this.timeKind === undefined) this.timeKind = kind;
    else if (this.timeKind !== kind) {
      invalid(
        `${where} holds "${t}", but earlier times were ${this.timeKind === "date" ? "dates" : "numbers"}: one column holds one kind of time`,
      );
    }
    return key;
  }

  finish(): LongTable {
    const origin = this.options.origin;
    if (this.columns === undefined || this.names === undefined) {
      invalid(`${origin} is empty: the first line must hold the column names`);
    }
    const rows = this.idOf.length;
    if (rows === 0) invalid(`${origin} has a header but no rows`);
    const idOf = this.idOf.view();
    const lines = this.lines.view();
    let times = this.times.view();
    let unit: Calendar["unit"] = this.timeKind === "date" ? "day" : "period";
    if (unit === "period") {
      const days = yyyymmddTimes(times);
      if (days !== undefined) {
        times = days;
        unit = "day";
      }
    }
    if (unit === "period") {
      for (let i = 0; i < rows; i++) {
        if (!Number.isInteger(times[i] as number)) {
          invalid(
            `line ${lines[i]} of ${origin}: the time ${times[i]} is not a whole number; periods are counted in whole numbers`,
          );
        }
      }
    } else if (allSameDayOfMonth(times)) {
      times = monthKeys(times);
      unit = "month";
    }

    // Group by id (counting sort keeps the file order within an id), then order by time.
    const { order, starts } = groupById(idOf, this.ids.length);
    let step = 0;
    for (let k = 0; k < this.ids.length; k++) {
      const segment = order.subarray(starts[k], starts[k + 1]);
      segment.sort((a, b) => (times[a] as number) - (times[b] as number));
      for (let j = 1; j < segment.length; j++) {
        const a = segment[j - 1] as number;
        const b = segment[j] as number;
        const difference = (times[b] as number) - (times[a] as number);
        if (difference === 0) {
          const [first, second] = (lines[a] as number) < (lines[b] as number) ? [a, b] : [b, a];
          invalid(
            `${this.names.id} "${this.ids[k]}" has two rows for ${this.timeText(times[a] as number, unit)}: lines ${lines[first]} and ${lines[second]} of ${origin}; keep one`,
          );
        }
        step = gcd(step, difference);
      }
    }
    if (step === 0) step = 1;

    const series: Series[] = [];
    const notAnalysed: { label: string; reason: string }[] = [];
    let filled = 0;
    let positions = 0;
    for (let k = 0; k < this.ids.length; k++) {
      const label = this.ids[k] as string;
      const segment = order.subarray(starts[k], starts[k + 1]);
      const first = times[segment[0] as number] as number;
      const last = times[segment[segment.length - 1] as number] as number;
      const length = (last - first) / step + 1;
      positions += length;
      if (positions > 10 * rows + 1000) {
        invalid(
          `the times of column "${this.names.time}" of ${origin} do not form a regular calendar: read ${calendarName({ unit, step, filled: 0 })}, they would leave more gaps than values`,
        );
      }
      filled += length - segment.length;
      const offender = this.offenders.get(k);
      if (offender !== undefined) {
        const where = `line ${offender.line}, column ${this.columns.value + 1} ("${this.names.value}") of ${origin}`;
        notAnalysed.push({
          label,
          reason: cellRefusal(where, offender.text, (t) =>
            textCellHint(t, this.options.cells ?? {}, this.options.words),
          ),
        });
        continue;
      }
      const values = new Float64Array(length).fill(NaN);
      for (const row of segment) {
        values[((times[row] as number) - first) / step] = this.values.at(row);
      }
      try {
        series.push(seriesFromColumn(values, label));
      } catch (error) {
        notAnalysed.push({ label, reason: (error as Error).message });
      }
    }
    return { series, notAnalysed, calendar: { unit, step, filled }, rows, names: this.names };
  }

  private timeText(key: number, unit: Calendar["unit"]): string {
    if (unit === "period") return `period ${key}`;
    if (unit === "month")
      return `${Math.floor(key / 12)}-${String((key % 12) + 1).padStart(2, "0")}`;
    return isoDate(key);
  }
}

/** Day numbers when every time is a yyyymmdd date, else undefined. */
function yyyymmddTimes(times: Float64Array): Float64Array | undefined {
  const days = new Float64Array(times.length);
  for (let i = 0; i < times.length; i++) {
    const day = yyyymmddDay(times[i] as number);
    if (day === undefined) return undefined;
    days[i] = day;
  }
  return days;
}

/** Whether every day falls on the same day of its month, or every one on its month's last day. */
function allSameDayOfMonth(days: Float64Array): boolean {
  if (days.length < 2) return false;
  const first = calendarDate(days[0] as number).day;
  let same = true;
  let monthEnds = true;
  for (let i = 0; i < days.length; i++) {
    const d = days[i] as number;
    if (calendarDate(d).day !== first) same = false;
    if (calendarDate(d + 1).day !== 1) monthEnds = false;
    if (!same && !monthEnds) return false;
  }
  // One date per month on the same day could still be weekly data that happens to align; a run
  // of several rows sharing the day of the month is monthly.
  return same || monthEnds;
}

function monthKeys(days: Float64Array): Float64Array {
  const keys = new Float64Array(days.length);
  for (let i = 0; i < days.length; i++) {
    const { year, month } = calendarDate(days[i] as number);
    keys[i] = year * 12 + month - 1;
  }
  return keys;
}

/**
 * Row indices grouped by id, file order kept within each id (a counting sort); the rows of id k
 * are order[starts[k] .. starts[k+1]).
 */
function groupById(idOf: Float64Array, ids: number): { order: Uint32Array; starts: Float64Array } {
  const starts = new Float64Array(ids + 1);
  for (let i = 0; i < idOf.length; i++) {
    const k = (idOf[i] as number) + 1;
    starts[k] = (starts[k] as number) + 1;
  }
  for (let k = 0; k < ids; k++) starts[k + 1] = (starts[k + 1] as number) + (starts[k] as number);
  const next = starts.slice(0, ids);
  const order = new Uint32Array(idOf.length);
  for (let i = 0; i < idOf.length; i++) {
    const k = idOf[i] as number;
    order[next[k] as number] = i;
    next[k] = (next[k] as number) + 1;
  }
  return { order, starts };
}

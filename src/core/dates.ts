/**
 * Dates as files carry them, turned into day numbers (days since 1970-01-01, proleptic Gregorian
 * calendar, no time zone): for recognising time columns and for ordering long-format rows.
 *
 * Read unambiguously: ISO 8601 dates `2024-01-31` (also with `/` or `.` between the parts), the
 * day-first dotted form `31.01.2024`, calendar months `2024-01` (the month's first day) and ISO
 * weeks `2024-W05` (the week's Monday; ISO 8601 week numbering), and whole numbers written as
 * `yyyymmdd`. A slashed `03/04/2024` is recognised as a date but not read: it could be either
 * day-first or month-first.
 */

const DAY_MS = 86_400_000;

function validDay(year: number, month: number, day: number): number | undefined {
  if (!(year >= 1 && year <= 9999 && month >= 1 && month <= 12 && day >= 1)) return undefined;
  const time = Date.UTC(year, month - 1, day);
  const back = new Date(time);
  if (back.getUTCDate() !== day || back.getUTCMonth() !== month - 1) return undefined;
  return Math.round(time / DAY_MS);
}

/** Monday of ISO week `week` of `year`: the week holding the year's first Thursday is week 1. */
function isoWeekMonday(year: number, week: number): number | undefined {
  if (!(week >= 1 && week <= 53)) return undefined;
  const jan4 = validDay(year, 1, 4) as number;
  const weekday = (((jan4 + 3) % 7) + 7) % 7; // 0 = Monday (1970-01-01 was a Thursday)
  const monday = jan4 - weekday + (week - 1) * 7;
  if (week === 53) {
    const nextJan4 = validDay(year + 1, 1, 4) as number;
    const nextWeekOne = nextJan4 - ((((nextJan4 + 3) % 7) + 7) % 7);
    if (monday >= nextWeekOne) return undefined;
  }
  return monday;
}

const ISO = /^(\d{4})[-/.](\d{1,2})[-/.](\d{1,2})(?:[T ]00:00(?::00(?:\.0+)?)?Z?)?$/;
const DOTTED = /^(\d{1,2})\.(\d{1,2})\.(\d{4})$/;
const MONTH = /^(\d{4})-(\d{2})$/;
const WEEK = /^(\d{4})-?W(\d{2})$/i;
const SLASHED = /^\d{1,2}\/\d{1,2}\/\d{2,4}$/;
const DATE_TIME = /^\d{4}-\d{2}-\d{2}[T ]\d{2}:\d{2}/;

/** The day number of a date read unambiguously, or undefined. */
export function dayNumber(text: string): number | undefined {
  const t = text.trim();
  let m = ISO.exec(t);
  if (m !== null) return validDay(Number(m[1]), Number(m[2]), Number(m[3]));
  m = DOTTED.exec(t);
  if (m !== null) return validDay(Number(m[3]), Number(m[2]), Number(m[1]));
  m = MONTH.exec(t);
  if (m !== null) return validDay(Number(m[1]), Number(m[2]), 1);
  m = WEEK.exec(t);
  if (m !== null) return isoWeekMonday(Number(m[1]), Number(m[2]));
  return undefined;
}

/** Whether text is a date in any common spelling (read or not): a time column's cell. */
export function looksLikeDate(text: string): boolean {
  const t = text.trim();
  return dayNumber(t) !== undefined || SLASHED.test(t) || DATE_TIME.test(t);
}

/** The day number of a whole number written yyyymmdd (years 1900–2100), or undefined. */
export function yyyymmddDay(value: number): number | undefined {
  if (!(Number.isInteger(value) && value >= 19000101 && value <= 21001231)) return undefined;
  return validDay(Math.floor(value / 10000), Math.floor(value / 100) % 100, value % 100);
}

/** Year, month (1–12) and day of a day number. */
export function calendarDate(day: number): { year: number; month: number; day: number } {
  const d = new Date(day * DAY_MS);
  return { year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate() };
}

/** A day number as yyyy-mm-dd. */
export function isoDate(day: number): string {
  return new Date(day * DAY_MS).toISOString().slice(0, 10);
}

/**
 * Serial day numbers of spreadsheets (1900 date system): 25569 is 1970-01-01. Whole numbers
 * from 18264 (1950-01-01) to 73050 (2099-12-31) that never fall are taken for such serials.
 * Source: the 1900 date system of spreadsheet files, ECMA-376 Part 1 §18.17.4.1 (from memory).
 */
export const SERIAL_DATE_RANGE: readonly [number, number] = [18264, 73050];

/**
 * progressLine(): drawn on stderr only when stderr is a terminal, at most once a second, and
 * erased at the end; never a word when stderr is a pipe or a file (a log stays clean).
 */
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { progressLine } from "../../src/cli/progress";

let written: string[] = [];
const tty = process.stderr.isTTY;

beforeEach(() => {
  written = [];
  vi.useFakeTimers();
  vi.setSystemTime(new Date("2026-12-02T10:00:00Z"));
  vi.spyOn(process.stderr, "write").mockImplementation((chunk: string | Uint8Array) => {
    written.push(String(chunk));
    return true;
  });
});

afterEach(() => {
  vi.restoreAllMocks();
  vi.useRealTimers();
  process.stderr.isTTY = tty;
});

describe("progressLine()", () => {
  it("redraws at most once a second on a terminal and erases itself when done", () => {
    process.stderr.isTTY = true;
    const progress = progressLine();
    progress.show("checking a.csv: 10 of 100 series");
    expect(written).toEqual([]);
    vi.advanceTimersByTime(1200);
    progress.show("checking a.csv: 50 of 100 series");
    progress.show("checking a.csv: 51 of 100 series");
    expect(written).toEqual(["\r\x1b[Kchecking a.csv: 50 of 100 series (1 s)"]);
    progress.done();
    expect(written.at(-1)).toBe("\r\x1b[K");
  });

  it("writes nothing when stderr is not a terminal", () => {
    process.stderr.isTTY = false;
    const progress = progressLine();
    vi.advanceTimersByTime(5000);
    progress.show("checking a.csv: 50 of 100 series");
    progress.done();
    expect(written).toEqual([]);
  });
});

/**
 * The pane's link to the workbook, without any DOM: it reads the selection when it changes, or —
 * once a range is pinned — re-reads that range whenever a change touches it, and hands each
 * reading to its listener. Readings can overlap (a fast series of selection events); only the
 * latest one is delivered.
 *
 * It listens only between `start` and `stop`: the pane stops it while hidden (in a shared runtime
 * the page, and any handler it registered, keeps running when the pane is closed: learn.microsoft
 * .com, "Show or hide the task pane of your Office Add-in"), and a pinned range stays pinned
 * across the pause.
 */
import { splitAddress } from "./address";
import { HostError, type ExcelRun } from "./excel";
import { followRange, type Following } from "./follow";
import { readRangeAt, readSelectedRange, type RangeRead, type ReadOptions } from "./readRange";
import { watchSelection, type Watching } from "./selection";

export interface SessionListener {
  /** A new reading to analyse. */
  onRead(read: RangeRead): void;
  /** Rows read so far of a long range. */
  onProgress(done: number, total: number): void;
  onError(error: unknown): void;
  /** The pinned address, or null when the pane follows the selection again. */
  onPinChange(pinned: string | null): void;
}

export class HostSession {
  private following: Following | null = null;
  private watching: Watching | null = null;
  private pinned: string | null = null;
  private running = false;
  private current: RangeRead | null = null;
  private generation = 0;

  constructor(
    private readonly run: ExcelRun,
    private readonly listener: SessionListener,
    private readonly readOptions: Omit<ReadOptions, "onProgress"> = {},
  ) {}

  /** The latest reading delivered. */
  get reading(): RangeRead | null {
    return this.current;
  }

  get pinnedAddress(): string | null {
    return this.pinned;
  }

  /** Whether the session listens to the workbook (between `start` and `stop`). */
  get listening(): boolean {
    return this.running;
  }

  /** Registers the handlers (the selection's, and the pinned range's) and reads afresh. */
  async start(): Promise<void> {
    if (this.running) return;
    this.running = true;
    this.watching = await watchSelection(this.run, () => this.onSelection());
    if (this.pinned !== null) this.following = await this.follow(this.pinned);
    await this.refresh();
  }

  /** Removes every handler; nothing is read until `start` again. */
  async stop(): Promise<void> {
    if (!this.running) return;
    this.running = false;
    this.generation++;
    const watching = this.watching;
    const following = this.following;
    this.watching = null;
    this.following = null;
    await watching?.stop();
    await following?.stop();
  }

  /** Pins the range last read (as selected, so a pinned whole column keeps its new rows). */
  async pin(): Promise<void> {
    const reading = this.current;
    if (reading === null || reading.rows === 0) {
      throw new HostError("select a range with values first, then pin it");
    }
    await this.following?.stop();
    this.following = null;
    this.pinned = reading.selected;
    if (this.running) this.following = await this.follow(reading.selected);
    this.listener.onPinChange(reading.selected);
  }

  async unpin(): Promise<void> {
    await this.following?.stop();
    this.following = null;
    this.pinned = null;
    this.listener.onPinChange(null);
    if (this.running) await this.refresh();
  }

  /** An edit inside the range always recomputes; a recalculation only if the values moved. */
  private follow(address: string): Promise<Following> {
    return followRange(this.run, address, (edited) =>
      this.refresh({ onlyIfChanged: edited === null }),
    );
  }

  /**
   * Reads the pinned range if there is one, else the selection, and delivers it; with
   * `onlyIfChanged`, only when its address or values differ from the last reading.
   */
  async refresh({
    onlyIfChanged = false,
  }: { readonly onlyIfChanged?: boolean } = {}): Promise<void> {
    const generation = ++this.generation;
    const options: ReadOptions = {
      ...this.readOptions,
      onProgress: (done, total) => {
        if (generation === this.generation) this.listener.onProgress(done, total);
      },
    };
    try {
      const pinned = this.pinnedAddress;
      const reading =
        pinned === null
          ? await readSelectedRange(this.run, options)
          : await readRangeAt(
              this.run,
              splitAddress(pinned).sheet,
              splitAddress(pinned).range,
              options,
            );
      if (generation !== this.generation) return;
      if (onlyIfChanged && this.current !== null && sameReading(this.current, reading)) return;
      this.current = reading;
      this.listener.onRead(reading);
    } catch (error) {
      if (generation === this.generation) this.listener.onError(error);
    }
  }

  private async onSelection(): Promise<void> {
    if (this.pinned !== null || !this.running) return;
    await this.refresh();
  }
}

/** Whether two readings have the same address and the same cell values. */
function sameReading(a: RangeRead, b: RangeRead): boolean {
  if (a.address !== b.address || a.rows !== b.rows || a.columns !== b.columns) return false;
  return a.cells.every((row, i) => {
    const other = b.cells[i];
    return (
      other !== undefined && row.length === other.length && row.every((v, j) => v === other[j])
    );
  });
}

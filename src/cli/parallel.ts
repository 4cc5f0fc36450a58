/**
 * Batch work on every core: the per-series stage of `batch` and `audit` runs in worker threads
 * (node:worker_threads), each running the same core function on the series it is handed, and the
 * results come back in the order of the series, so the cross-series step that follows (on the
 * main thread) sees exactly what a single-threaded run gives. Every per-series function is a pure
 * function of the series and the options (its draws are seeded from the data), so which worker
 * ran a series changes nothing.
 *
 * Memory stays bounded: series are taken from their source as workers need them, packed a chunk
 * at a time into two buffers that are moved (not copied) to the worker, and at most two chunks a
 * worker are in flight; no worker ever sees the whole table.
 *
 * The worker is this same bundle (build/echolot.cjs) started in a worker thread, so the CLI stays
 * one file that runs from any folder. `--workers 1` runs everything in-process.
 */
import { availableParallelism } from "node:os";
import { Worker, workerData, parentPort } from "node:worker_threads";
import {
  auditEntry,
  seriesResult,
  type AuditBatchEntry,
  type ForecastAuditOptions,
  type LagOptions,
  type Series,
  type SeriesResult,
} from "../core";
import { readingFrom } from "./csv";
import { streamManySeries, type SeriesStream } from "./input";
import { wholeNumberOption, type OptionValues } from "./options";
import { progressLine } from "./progress";

/** The per-series work a batch hands out. */
export type SeriesTask =
  | { readonly kind: "batch"; readonly options: LagOptions }
  | { readonly kind: "audit"; readonly options: ForecastAuditOptions };

type TaskResult<T extends SeriesTask> = T extends { kind: "batch" }
  ? SeriesResult
  : AuditBatchEntry;

/** The core function of one series for a task; `index` is the series' place in the batch. */
function runTask(task: SeriesTask, series: Series, index: number): SeriesResult | AuditBatchEntry {
  return task.kind === "batch"
    ? seriesResult(series, index, task.options)
    : auditEntry(series, index, task.options);
}

/**
 * Below this many series a batch runs in-process unless `--workers` says otherwise: starting a
 * worker (loading this bundle once more) costs about as much as checking a few hundred series.
 */
export const SMALL_BATCH = 500;

/**
 * `--workers N`: a whole number from 1 to 256 (1: in-process). Without it, every core this
 * process may use (os.availableParallelism), or 1 for a batch of fewer than `SMALL_BATCH` series.
 * `total` undefined checks the option only.
 */
export function workersOption(values: OptionValues, total?: number): number {
  const given = wholeNumberOption(values, "workers", 1, 256, "1 runs in-process");
  if (given === undefined) {
    return total !== undefined && total < SMALL_BATCH ? 1 : Math.max(1, availableParallelism());
  }
  return given;
}

/** Series of a chunk, packed into transferable buffers. */
interface PackedChunk {
  readonly chunk: number;
  /** Batch index of the chunk's first series. */
  readonly first: number;
  readonly labels: readonly string[];
  readonly values: Float64Array;
  readonly present: Uint8Array;
  /** Per series: length, count, gaps, start (NaN when absent), cells (NaN when absent). */
  readonly shape: Float64Array;
}

const SHAPE_FIELDS = 5;
/**
 * A chunk closes at this many series or values, whichever comes first: about a tenth of a second
 * of work on a busy core, so the workers share the last chunks evenly. An audit draws a Monte
 * Carlo reference for every series (several times a noise check's work): smaller chunks.
 */
const CHUNK_SERIES: Readonly<Record<SeriesTask["kind"], number>> = { batch: 64, audit: 16 };
const CHUNK_VALUES = 1 << 16;
/** Chunks in flight per worker: one running, one waiting, so a worker never idles. */
const IN_FLIGHT = 2;

function pack(chunk: number, first: number, list: readonly Series[]): PackedChunk {
  let total = 0;
  for (const series of list) total += series.values.length;
  const values = new Float64Array(total);
  const present = new Uint8Array(total);
  const shape = new Float64Array(list.length * SHAPE_FIELDS);
  let at = 0;
  list.forEach((series, i) => {
    values.set(series.values, at);
    present.set(series.present, at);
    at += series.values.length;
    shape.set(
      [series.values.length, series.count, series.gaps, series.start ?? NaN, series.cells ?? NaN],
      i * SHAPE_FIELDS,
    );
  });
  return { chunk, first, labels: list.map((s) => s.label), values, present, shape };
}

/** The series of a packed chunk, each exactly as it was packed (views into the chunk's buffers). */
function unpack(packed: PackedChunk): Series[] {
  const list: Series[] = [];
  let at = 0;
  packed.labels.forEach((label, i) => {
    const [length, count, gaps, start, cells] = packed.shape.subarray(
      i * SHAPE_FIELDS,
      (i + 1) * SHAPE_FIELDS,
    ) as unknown as [number, number, number, number, number];
    list.push({
      values: packed.values.subarray(at, at + length),
      present: packed.present.subarray(at, at + length),
      label,
      count,
      gaps,
      ...(Number.isNaN(start) ? {} : { start }),
      ...(Number.isNaN(cells) ? {} : { cells }),
    });
    at += length;
  });
  return list;
}

/** Takes series from the source a chunk at a time. */
function chunker(source: Iterable<Series>, most: number): () => Series[] | undefined {
  const iterator = source[Symbol.iterator]();
  let pending: Series | undefined;
  let ended = false;
  return () => {
    const list: Series[] = [];
    let values = 0;
    while (list.length < most && values < CHUNK_VALUES) {
      let next = pending;
      pending = undefined;
      if (next === undefined) {
        if (ended) break;
        const step = iterator.next();
        if (step.done === true) {
          ended = true;
          break;
        }
        next = step.value;
      }
      if (list.length > 0 && values + next.values.length > CHUNK_VALUES) {
        pending = next;
        break;
      }
      list.push(next);
      values += next.values.length;
    }
    return list.length === 0 ? undefined : list;
  };
}

export interface MapOptions {
  /** Worker threads; 1 runs in-process. */
  readonly workers: number;
  /** How many series to expect at most, for the progress line. */
  readonly total: number;
  /** What the progress line calls the work ("checking data.csv"). */
  readonly what: string;
}

/**
 * The task's result for every series of `source`, in source order, computed in `workers` worker
 * threads (in-process for 1). Rejects with the first failure that is not a refusal of a series
 * (those are results); the workers are stopped then.
 */
export async function mapSeries<T extends SeriesTask>(
  source: Iterable<Series>,
  task: T,
  options: MapOptions,
): Promise<TaskResult<T>[]> {
  const progress = progressLine();
  const show = (done: number) =>
    progress.show(
      `${options.what}: ${done.toLocaleString("en")} of ${options.total.toLocaleString("en")} series`,
    );
  const results: TaskResult<T>[] = [];
  if (options.workers <= 1) {
    let index = 0;
    for (const series of source) {
      results.push(runTask(task, series, index++) as TaskResult<T>);
      if ((index & 0xff) === 0) show(index);
    }
    progress.done();
    return results;
  }
  const chunks = await inWorkers(source, task, options.workers, show);
  for (const chunk of chunks) for (const result of chunk) results.push(result as TaskResult<T>);
  progress.done();
  return results;
}

/**
 * Reads every series of `file` and runs the task on each (worker threads as `--workers` says),
 * for `batch` and `audit`: the series stream (its `notAnalysed` complete) and the results in
 * series order. `verb` names the work on the progress line.
 */
export async function eachSeriesOf<T extends SeriesTask>(
  file: string,
  values: OptionValues,
  task: T,
  verb: string,
): Promise<{ many: SeriesStream; results: TaskResult<T>[] }> {
  workersOption(values);
  const many = await streamManySeries(readingFrom(file, values), values);
  const results = await mapSeries(many.series, task, {
    workers: workersOption(values, many.total),
    total: many.total,
    what: `${verb} ${file === "-" ? "standard input" : file}`,
  });
  return { many, results };
}

interface WorkerReply {
  readonly chunk: number;
  readonly results?: readonly (SeriesResult | AuditBatchEntry)[];
  readonly failure?: string;
}

function inWorkers(
  source: Iterable<Series>,
  task: SeriesTask,
  count: number,
  show: (done: number) => void,
): Promise<(readonly (SeriesResult | AuditBatchEntry)[])[]> {
  const next = chunker(source, CHUNK_SERIES[task.kind]);
  const done: (readonly (SeriesResult | AuditBatchEntry)[])[] = [];
  const workers: Worker[] = [];
  let sent = 0;
  let first = 0;
  let received = 0;
  let finished = 0;
  let failed = false;
  return new Promise((resolve, reject) => {
    const fail = (error: Error) => {
      if (failed) return;
      failed = true;
      for (const worker of workers) void worker.terminate();
      reject(error);
    };
    // Hands the worker its next chunk, if any is left.
    const feed = (worker: Worker): void => {
      let list: Series[] | undefined;
      try {
        list = next();
      } catch (error) {
        fail(error as Error);
        return;
      }
      if (list === undefined) return;
      const packed = pack(sent++, first, list);
      first += list.length;
      // Fresh buffers of this chunk: moved to the worker, not copied.
      worker.postMessage(packed, [
        packed.values.buffer as ArrayBuffer,
        packed.present.buffer as ArrayBuffer,
      ]);
    };
    const settle = () => {
      if (failed || received < sent) return;
      for (const worker of workers) void worker.terminate();
      resolve(done);
    };
    for (let w = 0; w < count; w++) {
      const worker = new Worker(__filename, { workerData: { echolotSeriesTask: task } });
      workers.push(worker);
      worker.on("message", (reply: WorkerReply) => {
        if (failed) return;
        if (reply.failure !== undefined) {
          fail(new Error(`a worker thread failed: ${reply.failure}`));
          return;
        }
        done[reply.chunk] = reply.results ?? [];
        received++;
        finished += reply.results?.length ?? 0;
        show(finished);
        feed(worker);
        settle();
      });
      worker.on("error", (error) => fail(error));
      worker.on("exit", (code) => {
        if (!failed && received < sent && code !== 0) {
          fail(new Error(`a worker thread stopped with status ${code}`));
        }
      });
    }
    for (let round = 0; round < IN_FLIGHT; round++) {
      for (const worker of workers) feed(worker);
    }
    settle();
  });
}

/** Whether this thread is a batch worker started by `mapSeries`. */
export function isSeriesWorker(): boolean {
  return (
    parentPort !== null &&
    typeof workerData === "object" &&
    workerData !== null &&
    "echolotSeriesTask" in workerData
  );
}

/** The worker's side: runs the task on every chunk it is sent and replies with the results. */
export function serveSeriesTasks(): void {
  const task = (workerData as { echolotSeriesTask: SeriesTask }).echolotSeriesTask;
  const port = parentPort;
  if (port === null) return;
  port.on("message", (packed: PackedChunk) => {
    try {
      const results = unpack(packed).map((series, i) => runTask(task, series, packed.first + i));
      port.postMessage({ chunk: packed.chunk, results } satisfies WorkerReply);
    } catch (error) {
      port.postMessage({
        chunk: packed.chunk,
        failure: (error as Error).stack ?? String(error),
      } satisfies WorkerReply);
    }
  });
}

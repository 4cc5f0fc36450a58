/**
 * How the host glue reaches the workbook: a function with the shape of `Excel.run`, passed in so
 * the mock tests can hand over a fake workbook. Nothing here computes statistics.
 */
export type ExcelRun = <T>(batch: (context: Excel.RequestContext) => Promise<T>) => Promise<T>;

/** The real host's `Excel.run`, looked up when called (the global exists only inside a host). */
export const hostRun: ExcelRun = (batch) => Excel.run(batch);

/** A failure the user should read in the pane, worded as what to do. */
export class HostError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "HostError";
  }
}

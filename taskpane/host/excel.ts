/**
 * How the host glue reaches the workbook: a function with the shape of `Excel.run`, passed in so
 * the mock tests can hand over a fake workbook. Nothing here computes statistics.
 */

/**
 * `Excel.run(batch)` for a new request context, and `Excel.run(context, batch)` for work that must
 * use an earlier context: removing an event handler must use the context the handler was added in
 * (OfficeExtension.EventHandlerResult in @types/office-js; learn.microsoft.com, "Work with events
 * using the Excel JavaScript API", section "Remove an event handler").
 */
export interface ExcelRun {
  <T>(batch: (context: Excel.RequestContext) => Promise<T>): Promise<T>;
  <T>(
    context: OfficeExtension.ClientRequestContext,
    batch: (context: Excel.RequestContext) => Promise<T>,
  ): Promise<T>;
}

/** The real host's `Excel.run`, looked up when called (the global exists only inside a host). */
export const hostRun: ExcelRun = (<T>(
  first: OfficeExtension.ClientRequestContext | ((context: Excel.RequestContext) => Promise<T>),
  batch?: (context: Excel.RequestContext) => Promise<T>,
): Promise<T> =>
  typeof first === "function"
    ? Excel.run(first)
    : Excel.run(first, batch as (context: Excel.RequestContext) => Promise<T>)) as ExcelRun;

/**
 * Which ExcelApi requirement sets the host supports, asked with
 * `Office.context.requirements.isSetSupported("ExcelApi", version)` (learn.microsoft.com,
 * "Specify Office applications and API requirements"). Passed in like `ExcelRun`.
 */
export type ApiSupport = (version: string) => boolean;

export const hostSupport: ApiSupport = (version) =>
  typeof Office !== "undefined" &&
  Office.context?.requirements?.isSetSupported("ExcelApi", version) === true;

/** A failure the user should read in the pane, worded as what to do. */
export class HostError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "HostError";
  }
}

/**
 * The code of a failed request (OfficeExtension.Error's `code`, one of Excel.ErrorCodes such as
 * "InvalidSelection" or "ResponsePayloadSizeLimitExceeded"), or undefined for anything else.
 */
export function requestErrorCode(error: unknown): string | undefined {
  if (typeof error !== "object" || error === null) return undefined;
  const code = (error as { code?: unknown }).code;
  return typeof code === "string" ? code : undefined;
}

/**
 * `echolot check FILE [options]`: the lag table and verdict of one column, with the side checks
 * beside it — volatility (Engle's LM over the table's lags, McLeod–Li), bias (Newey–West), runs
 * about the median and Jarque–Bera. A side check the data cannot support (say, constant squared
 * deviations) is left out of the text and written as null in the JSON, with its reason. The
 * column analysed is named first, with any column passed over on the way to it; then the headline
 * (core/headline.ts): when volatility clusters, the table shown is the robust reading.
 */
import { headlineOf, lagTable, needsRobustReading, robustOptions, type Headline } from "../core";
import { jointSpanText, lagTableText } from "../report";
import { sideChecks, sideChecksText } from "../report/sideChecks";
import { readingFrom } from "./csv";
import { UsageError } from "./errors";
import { readOneSeries } from "./input";
import { releaseBetweenSteps } from "./memory";
import { checkJson, toJsonText } from "./json";
import {
  LAG_OPTIONS,
  lagOptionsFromFlags,
  READ_OPTIONS,
  textOption,
  type ParsedCommand,
} from "./options";

export const CHECK_OPTIONS = ["column", ...LAG_OPTIONS, ...READ_OPTIONS, "json"];

export async function runCheck({ files, values }: ParsedCommand): Promise<string> {
  const file = files[0];
  if (file === undefined)
    throw new UsageError(
      "check needs a CSV file: echolot check FILE.csv (or - for standard input)",
    );
  const options = lagOptionsFromFlags(values);
  const { series, source } = await readOneSeries(
    readingFrom(file, values),
    textOption(values, "column"),
  );
  const release = () => releaseBetweenSteps(series.count);
  release();
  const plain = lagTable(series, options);
  const side = sideChecks(series, plain, release);
  // When volatility clusters, the headline and the table shown are the robust reading.
  const robust = needsRobustReading(plain, side.volatility)
    ? (release(), lagTable(series, robustOptions(options)))
    : null;
  const result = robust ?? plain;
  const headline = headlineOf(plain, robust, side.volatility, side.bias);
  return values.json === true
    ? toJsonText(checkJson(source, headline, result, side))
    : `read: ${source}\n\n${headlineText(headline)}\n\n${lagTableText(result)}\n\n${jointSpanText(result)}\n\n${sideChecksText(side)}`;
}

/** The headline first: its title, then every finding that fired, one per line. */
function headlineText(headline: Headline): string {
  return [`headline: ${headline.title}`, ...headline.findings.map((f) => `  ${f}`)].join("\n");
}

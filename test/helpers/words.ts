import type { OptionWords } from "../../src/core";

/** The reader's hints worded as on the command line, for core tests of the table readers. */
export const CLI_LIKE_WORDS: OptionWords = {
  percent: "give --percent",
  gapWord: (w) => `give --na ${w}`,
  decimalComma: "give --decimal ,",
  noHeader: "give --no-header",
};

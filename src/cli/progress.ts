/**
 * A progress line on stderr for long runs, only when stderr is a terminal (never in a pipe or a
 * log): redrawn at most once a second, erased when the work is done.
 */
export interface ProgressLine {
  /** Redraws the line with `text` if a second has passed since the last redraw. */
  show(text: string): void;
  /** Erases the line if it was ever drawn. */
  done(): void;
}

export function progressLine(): ProgressLine {
  const tty = process.stderr.isTTY === true;
  const started = Date.now();
  let last = started;
  let shown = false;
  return {
    show(text) {
      const now = Date.now();
      if (!tty || now - last < 1000) return;
      last = now;
      shown = true;
      const seconds = Math.round((now - started) / 1000);
      process.stderr.write(`\r\x1b[K${text} (${seconds} s)`);
    },
    done() {
      if (shown) process.stderr.write("\r\x1b[K");
    },
  };
}

/**
 * Saving text as a file from the standalone page: a link to an object URL, clicked. The browser
 * asks where to save or saves to its downloads folder, as it does for any download.
 */
export function downloadText(text: string, fileName: string, type: string): void {
  const link = document.createElement("a");
  link.href = URL.createObjectURL(new Blob([text], { type }));
  link.download = fileName;
  link.click();
  setTimeout(() => URL.revokeObjectURL(link.href), 10_000);
}

/** A file name from free text: letters, digits, "-" and "_" only. */
export function fileNamePart(text: string, fallback: string): string {
  const part = text.replace(/[^A-Za-z0-9_-]+/g, "-").replace(/^-+|-+$/g, "");
  return part === "" ? fallback : part.slice(0, 60);
}

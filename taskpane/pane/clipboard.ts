/**
 * Copying text for "Copy summary". The asynchronous clipboard is tried first; a task pane's
 * frame may refuse it, so a selected hidden text area and the copy command are the fallback.
 */
export async function copyText(text: string, buffer: HTMLTextAreaElement): Promise<boolean> {
  try {
    if (navigator.clipboard !== undefined) {
      await navigator.clipboard.writeText(text);
      return true;
    }
  } catch {
    // Refused (no permission in this frame): fall back to the copy command below.
  }
  buffer.value = text;
  buffer.select();
  const copied = document.execCommand("copy");
  buffer.blur();
  return copied;
}

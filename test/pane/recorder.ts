/** A session listener that keeps what it is told, for assertions. */
import type { RangeRead } from "../../taskpane/host/readRange";

export function recorder() {
  const reads: RangeRead[] = [];
  const pins: (string | null)[] = [];
  const errors: unknown[] = [];
  return {
    reads,
    pins,
    errors,
    listener: {
      onRead: (read: RangeRead) => reads.push(read),
      onProgress: () => {},
      onError: (error: unknown) => errors.push(error),
      onPinChange: (pinned: string | null) => pins.push(pinned),
    },
  };
}

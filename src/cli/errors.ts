/** A mistake in the command line itself (unknown option, missing file): exit status 2. */
export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "UsageError";
  }
}

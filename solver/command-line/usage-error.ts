/** A mistake in the command line's arguments: the command line prints its message after `error:` and exits 2. */
export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}

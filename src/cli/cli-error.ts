/** A command-line problem the user can fix: printed as one line, exit code 2. */
export class CliError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CliError';
  }
}

/** The command line's exit codes, as CI pipelines read them. */
export const EXIT = {
  /** Every loop passes (or only warns, without --fail-on-warn). */
  passed: 0,
  /** A loop fails (or warns, with --fail-on-warn). */
  failed: 1,
  /** Unusable input: arguments, an unreadable or invalid file, a request the service refuses (4xx). */
  unusableInput: 2,
  /** The check could not be carried out: the server is unreachable or answered 5xx, or a fault inside loopgate. */
  notRun: 3,
} as const;

/** An error the command line reports in one line and exits with `exitCode`. */
export class CliError extends Error {
  constructor(
    message: string,
    readonly exitCode: number,
  ) {
    super(message);
    this.name = 'CliError';
  }
}

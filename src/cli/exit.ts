/** Exit codes and the guard that turns failures into messages (never a stack trace for user errors). */
import { ConfigError, formatProblems } from '../config/problems.js';

export const EXIT_OK = 0;
export const EXIT_FAILED = 1;
export const EXIT_USAGE = 2;

/** A failure to report to the user with a message and an exit code. */
export class UserFacingError extends Error {
  constructor(
    message: string,
    readonly exitCode: number,
  ) {
    super(message);
    this.name = 'UserFacingError';
  }
}

export async function runGuarded(action: () => Promise<number> | number): Promise<void> {
  try {
    process.exitCode = await action();
  } catch (error) {
    if (error instanceof ConfigError) {
      process.stderr.write(`${formatProblems(error.problems, error.sources)}\n`);
      process.exitCode = EXIT_USAGE;
    } else if (error instanceof UserFacingError) {
      process.stderr.write(`jostle: ${error.message}\n`);
      process.exitCode = error.exitCode;
    } else {
      const text = error instanceof Error ? (error.stack ?? error.message) : String(error);
      process.stderr.write(`jostle: internal error — please report it with the command you ran.\n${text}\n`);
      process.exitCode = EXIT_FAILED;
    }
  }
}

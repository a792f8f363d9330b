/** Exit codes and the guard that turns failures into messages (never a stack trace for user errors). */
import { ConfigError, formatProblems } from '../config/problems.js';
import { JournalError } from '../experiment/journal.js';

/** File-system failures worth a plain message (the path and what went wrong), not a stack trace. */
const FS_CODES: Record<string, string> = {
  ENOTDIR: 'a part of the path is a file, not a folder',
  EISDIR: 'it is a folder',
  EACCES: 'permission denied',
  EPERM: 'operation not permitted',
  EROFS: 'read-only file system',
  ENOSPC: 'no space left on the device',
  EDQUOT: 'disk quota exceeded',
  ENOENT: 'no such file or folder',
  EEXIST: 'it already exists',
};

function fsProblem(error: unknown): string | undefined {
  if (!(error instanceof Error)) return undefined;
  const { code, path } = error as NodeJS.ErrnoException;
  if (code === undefined || path === undefined || !(code in FS_CODES)) return undefined;
  return `cannot use ${path}: ${FS_CODES[code]} (${code})`;
}

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
    } else if (error instanceof JournalError) {
      process.stderr.write(`jostle: ${error.message}. Run again with --restart to discard the journal, or remove the folder's journal/.\n`);
      process.exitCode = EXIT_USAGE;
    } else if (fsProblem(error) !== undefined) {
      process.stderr.write(`jostle: ${fsProblem(error)}\n`);
      process.exitCode = EXIT_FAILED;
    } else {
      const text = error instanceof Error ? (error.stack ?? error.message) : String(error);
      process.stderr.write(`jostle: internal error — please report it with the command you ran.\n${text}\n`);
      process.exitCode = EXIT_FAILED;
    }
  }
}

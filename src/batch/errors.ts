/** A run that cannot start or go on (bad limit set, unsafe output folder, busy lock): exit 2. */
export class RunError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RunError';
  }
}

/** The run was stopped by SIGINT; the message says how far it got. Exit 130. */
export class InterruptedError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'InterruptedError';
  }
}

/**
 * One InputError as a line in the project's grammar (`<file>:<line>:<col>: message`). Readers
 * already put the location in their messages; it is added only when missing.
 */
export function formatInputError(e: { file: string; line?: number; column?: number; message: string }): string {
  const where = [e.file, e.line, e.column].filter((x) => x !== undefined && x !== '').join(':');
  if (!where || e.message.startsWith(`${e.file}:`) || e.message.startsWith(where)) return e.message;
  return `${where}: ${e.message}`;
}

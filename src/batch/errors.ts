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

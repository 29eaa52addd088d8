/** The CLI's exit codes; the pure function lives with the batch so runAnalyze can return it. */
export { exitCode, EXIT_INTERNAL, EXIT_INTERRUPTED } from '../batch/exitCode.js';

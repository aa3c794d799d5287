/** A start that cannot go on; the message says what to set. The server prints it as one line, without a stack. */
export class StartupError extends Error {
  override name = 'StartupError';
}

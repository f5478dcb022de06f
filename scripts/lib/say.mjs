// Plain console output for the orchestration scripts (Node built-ins only).
const useColour = process.stdout.isTTY && !process.env.NO_COLOR;
const paint = (code, text) => (useColour ? `\u001b[${code}m${text}\u001b[0m` : text);

/** Prints a step heading. */
export function step(text) {
  process.stdout.write(`${paint('36', '›')} ${text}\n`);
}

/** Prints a quiet detail line. */
export function info(text) {
  process.stdout.write(`  ${text}\n`);
}

/** Prints a success line. */
export function ok(text) {
  process.stdout.write(`${paint('32', '✓')} ${text}\n`);
}

/** An error meant for the person at the terminal: what went wrong and what to do next. */
export class SetupError extends Error {
  constructor(message, hint) {
    super(message);
    this.name = 'SetupError';
    this.hint = hint;
  }
}

/** Prints a failure with its hint, for errors thrown during set-up. */
export function fail(error) {
  process.stderr.write(`${paint('31', '✗')} ${error.message}\n`);
  if (error.hint) process.stderr.write(`  ${error.hint}\n`);
  if (!(error instanceof SetupError) && error.stack) process.stderr.write(`${error.stack}\n`);
}

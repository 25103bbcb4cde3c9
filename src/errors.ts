/**
 * An error in what the user gave us (a file, an option, a role map). The CLI prints its
 * message as one line and exits 2; anything else is a bug in nestready.
 */
export class InputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'InputError';
  }
}

/** Throw an InputError that starts with the file it is about. */
export function inputError(file: string, message: string): never {
  throw new InputError(`${file}: ${message}`);
}

/**
 * A name from the user's files (a column, a role-map key, a rule id) as it goes into an error:
 * JSON-quoted, so that a newline or a quote in it cannot break the one-line message.
 */
export function quoteName(name: string): string {
  return JSON.stringify(name);
}

/** Names listed in an error (a header): plain where plain, quoted where a name would blur the list. */
export function nameList(names: readonly string[]): string {
  // biome-ignore lint/suspicious/noControlCharactersInRegex: control characters are what must be quoted
  return names.map((n) => (/^[^\u0000-\u001f\u007f",]*$/.test(n) && n.trim() === n && n !== '' ? n : quoteName(n))).join(', ');
}

/**
 * An engine's error while it reads a delivery that opened (a JSON record with a duplicate key, a
 * bad value deep in the file, memory): an input error naming the file. Anything else is passed on.
 */
export function readError(e: unknown, file: string): unknown {
  if (e instanceof InputError || !(e instanceof Error)) return e;
  const first = ownCopiesNamed(e.message.split('\n')[0], file);
  if (/^Invalid Input Error: /.test(first)) return new InputError(`${file}: cannot read the delivery (${first.slice(21)})`);
  if (/Out of Memory Error/i.test(first)) {
    return new InputError(`${file}: out of memory within --memory-limit (${first}); raise --memory-limit`);
  }
  return e;
}

/**
 * The tool's own temp copies of a delivery (standard input spooled, an LF or UTF-8 copy: see
 * stdin.ts and formats/temp-copy.ts) as the engine names them in an error: the user gave no such
 * path, so the message names the delivery as they gave it (`-` for standard input).
 */
const OWN_COPY = /(?:[A-Za-z]:)?[^\s"'(]*nestready-(?:stdin|lf|utf8)-[A-Za-z0-9]{6}[\\/][^\s"',)]+/g;

/** An engine's message with the paths of the tool's own temp copies replaced by `display`. */
export function ownCopiesNamed(message: string, display: string): string {
  return message.replace(OWN_COPY, display);
}

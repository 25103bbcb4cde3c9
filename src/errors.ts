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

const OFFSET = 0xcbf29ce484222325n;
const PRIME = 0x100000001b3n;
const MASK = (1n << 64n) - 1n;

/**
 * A 64-bit FNV-1a hash of a text's UTF-8 bytes, as 16 hex digits: a value kept by its hash shows
 * that it changed without showing what it was. Not a secret: a value from a small set (a sector,
 * a yes/no) can be found again by hashing every candidate, as README's snapshot section says.
 */
export function hashText(text: string): string {
  let h = OFFSET;
  for (const byte of new TextEncoder().encode(text)) h = ((h ^ BigInt(byte)) * PRIME) & MASK;
  return h.toString(16).padStart(16, '0');
}

/**
 * Text that PostgreSQL cannot store faithfully: U+0000 is refused in JSONB and would be kept as the characters
 * "\0" in a text column, and a lone UTF-16 surrogate is not a character at all. One rule, used by every text
 * field of the shared schemas and, as a net under them, by the server's edge over every JSON body and query.
 */

export const unsafeTextMessage = 'must not contain a NUL character or a broken (lone surrogate) character';

// NUL, a high surrogate not followed by a low one, or a low surrogate not preceded by a high one.
const unsafeCharacter = /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export function isSafeText(value: string): boolean {
  return !unsafeCharacter.test(value);
}

/** The path of the first string (or object key) in a parsed JSON value that is not safe text, or null. */
export function findUnsafeText(value: unknown, path: (string | number)[] = []): (string | number)[] | null {
  if (typeof value === 'string') return isSafeText(value) ? null : path;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i += 1) {
      const found = findUnsafeText(value[i], [...path, i]);
      if (found) return found;
    }
    return null;
  }
  if (value && typeof value === 'object') {
    for (const [key, inner] of Object.entries(value)) {
      if (!isSafeText(key)) return [...path, key];
      const found = findUnsafeText(inner, [...path, key]);
      if (found) return found;
    }
  }
  return null;
}

/**
 * Instants Mendstep accepts: from 1900 to 2199 (ours). Anything outside is a typing slip or a probe, and
 * year 0000 or 10000 would reach PostgreSQL as a date it rejects or misreads.
 */
export const earliestAcceptedInstant = Date.UTC(1900, 0, 1);
export const latestAcceptedInstant = Date.UTC(2200, 0, 1);
export const instantYearsMessage = 'must be between the years 1900 and 2199';

export function isSensibleInstant(ms: number): boolean {
  return Number.isFinite(ms) && ms >= earliestAcceptedInstant && ms < latestAcceptedInstant;
}

/** Deeper than any payload of ours: a body nested further is refused, not walked. */
export const MAX_DEPTH = 64;

export class TooDeepError extends Error {}

/**
 * Replaces lone UTF-16 surrogates (valid in JSON text, invalid in MariaDB's JSON and utf8mb4) with
 * U+FFFD, deep through plain objects and arrays, so free text from any client can be stored.
 */
export function wellFormed<T>(value: T, depth = 0): T {
  if (typeof value === 'string') return value.toWellFormed() as T;
  if (depth > MAX_DEPTH) throw new TooDeepError('nested too deeply');
  if (Array.isArray(value)) return value.map((v) => wellFormed(v, depth + 1)) as T;
  if (value !== null && typeof value === 'object' && Object.getPrototypeOf(value) === Object.prototype) {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, wellFormed(v, depth + 1)])) as T;
  }
  return value;
}

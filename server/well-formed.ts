/**
 * Replaces lone UTF-16 surrogates (valid in JSON text, invalid in MariaDB's JSON and utf8mb4) with
 * U+FFFD, deep through plain objects and arrays, so free text from any client can be stored.
 */
export function wellFormed<T>(value: T): T {
  if (typeof value === 'string') return value.toWellFormed() as T;
  if (Array.isArray(value)) return value.map(wellFormed) as T;
  if (value !== null && typeof value === 'object' && Object.getPrototypeOf(value) === Object.prototype) {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, wellFormed(v)])) as T;
  }
  return value;
}

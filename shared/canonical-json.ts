// JSON with object keys sorted and undefined members left out: the same value always gives the
// same text. The audit chain hashes it (server/services/audit.ts); an approval's basis compares
// item ratings with it (shared/rules/approval-basis.ts), whatever order the keys were stored in.
export function canonical(value: unknown): string {
  if (value === undefined || value === null) return 'null';
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonical(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

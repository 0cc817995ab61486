/**
 * A JSON_ARRAYAGG column as an array: mysql2 parses MariaDB's JSON results itself, but a driver or proxy that
 * passes the text through is read too. NULL (no rows aggregated) is an empty array.
 */
export function jsonArray<T = string>(value: unknown): T[] {
  if (value === null || value === undefined) return [];
  return (typeof value === 'string' ? JSON.parse(value) : value) as T[];
}

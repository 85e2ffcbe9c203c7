/**
 * A prepared statement takes one value per placeholder: each `?` whose value is an array becomes one
 * `?` per element (an empty array becomes NULL, which matches nothing in `IN (…)`). The SQL here is
 * the project's own (no `?` inside string literals); the values stay parameters, never text.
 */
export function expandListPlaceholders(sql: string, params: readonly unknown[]): { sql: string; values: unknown[] } {
  const values: unknown[] = [];
  let at = 0;
  const expanded = sql.replace(/\?/g, () => {
    const value = params[at++];
    if (!Array.isArray(value)) {
      values.push(value);
      return '?';
    }
    if (value.length === 0) return 'NULL';
    values.push(...(value as unknown[]));
    return value.map(() => '?').join(', ');
  });
  if (at !== params.length) throw new Error(`expandListPlaceholders: ${params.length} values for ${at} placeholders`);
  return { sql: expanded, values };
}


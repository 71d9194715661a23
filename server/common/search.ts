import { Raw, type FindOperator } from 'typeorm';

/**
 * Case-insensitive "contains" that treats % and _ in the search as text. Written as standard SQL
 * (LOWER … LIKE … ESCAPE) so it behaves the same on SQLite and PostgreSQL.
 */
export function containsText(search: string): FindOperator<string> {
  const pattern = `%${search.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
  return Raw((column) => `LOWER(${column}) LIKE :pattern ESCAPE '\\'`, { pattern });
}

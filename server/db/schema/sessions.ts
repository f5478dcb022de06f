import { int, mediumtext, mysqlTable, varchar, index } from 'drizzle-orm/mysql-core';

/**
 * Session rows written by express-mysql-session (column names match its defaults, so the
 * store never creates its own table: this migration owns it).
 */
export const sessions = mysqlTable(
  'sessions',
  {
    sessionId: varchar('session_id', { length: 128 }).primaryKey(),
    expires: int('expires', { unsigned: true }).notNull(),
    data: mediumtext('data'),
  },
  (t) => [index('sessions_expires_idx').on(t.expires)],
);

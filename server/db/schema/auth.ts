import { sql } from 'drizzle-orm';
import {
  bigint,
  char,
  datetime,
  foreignKey,
  index,
  int,
  mysqlEnum,
  mysqlTable,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';
import { users } from './users';

export const EMAIL_TOKEN_KINDS = ['verify', 'reset', 'email-change'] as const;

/**
 * Single-use tokens sent by e-mail. Only the SHA-256 of the token is stored, so a database
 * leak does not hand out working links.
 */
export const emailTokens = mysqlTable(
  'email_tokens',
  {
    id: int('id').autoincrement().primaryKey(),
    userId: int('user_id').notNull(),
    kind: mysqlEnum('kind', EMAIL_TOKEN_KINDS).notNull(),
    tokenHash: char('token_hash', { length: 64 }).notNull(),
    newEmail: varchar('new_email', { length: 254 }),
    expiresAt: datetime('expires_at', { mode: 'date' }).notNull(),
    usedAt: datetime('used_at', { mode: 'date' }),
    createdAt: datetime('created_at', { mode: 'date' })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP`),
  },
  (t) => [
    uniqueIndex('email_tokens_hash_unique').on(t.tokenHash),
    index('email_tokens_user_kind_idx').on(t.userId, t.kind),
    foreignKey({
      name: 'email_tokens_user_fk',
      columns: [t.userId],
      foreignColumns: [users.id],
    }).onDelete('cascade'),
  ],
);

/**
 * Counters of rate-limiter-flexible's MySQL store (its own column layout), shared by every
 * app server.
 */
export const rateLimits = mysqlTable('rate_limits', {
  key: varchar('key', { length: 255 }).primaryKey(),
  points: int('points').notNull().default(0),
  expire: bigint('expire', { mode: 'number', unsigned: true }),
});

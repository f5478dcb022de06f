import { sql } from 'drizzle-orm';
import {
  boolean,
  datetime,
  index,
  int,
  mysqlEnum,
  mysqlTable,
  text,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';

export const ROLES = ['member', 'moderator', 'admin'] as const;
export const UNIT_SYSTEMS = ['metric', 'us'] as const;

/** Members of the site. Passwords are argon2id hashes; e-mail is stored lower-cased. */
export const users = mysqlTable(
  'users',
  {
    id: int('id').autoincrement().primaryKey(),
    email: varchar('email', { length: 254 }).notNull(),
    emailVerifiedAt: datetime('email_verified_at', { mode: 'date' }),
    handle: varchar('handle', { length: 32 }).notNull(),
    displayName: varchar('display_name', { length: 80 }).notNull(),
    passwordHash: varchar('password_hash', { length: 255 }).notNull(),
    role: mysqlEnum('role', ROLES).notNull().default('member'),
    units: mysqlEnum('units', UNIT_SYSTEMS).notNull().default('metric'),
    remindersEnabled: boolean('reminders_enabled').notNull().default(true),
    /** E-mail the member when someone comments on one of their journals. */
    notifyComments: boolean('notify_comments').notNull().default(true),
    bio: text('bio'),
    /** Bumped when the member resets their calendar address (the address is signed with it). */
    calendarVersion: int('calendar_version').notNull().default(0),
    disabledAt: datetime('disabled_at', { mode: 'date' }),
    createdAt: datetime('created_at', { mode: 'date' })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP`),
    updatedAt: datetime('updated_at', { mode: 'date' })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP`)
      .$onUpdate(() => new Date()),
  },
  (t) => [
    uniqueIndex('users_email_unique').on(t.email),
    uniqueIndex('users_handle_unique').on(t.handle),
    index('users_role_idx').on(t.role),
  ],
);

import { sql } from 'drizzle-orm';
import {
  char,
  customType,
  date,
  datetime,
  foreignKey,
  index,
  int,
  mediumtext,
  mysqlEnum,
  mysqlTable,
  tinyint,
  uniqueIndex,
} from 'drizzle-orm/mysql-core';
import { journals } from './journals';
import { users } from './users';

// MariaDB stores JSON as LONGTEXT and mysql2 hands it back as a string: parse it here.
const jsonList = customType<{ data: string[]; driverData: string }>({
  dataType: () => 'json',
  toDriver: (value) => JSON.stringify(value),
  fromDriver: (value) =>
    typeof value === 'string' ? (JSON.parse(value) as string[]) : (value as string[]),
});

/**
 * One scorecard for one wheel at one age. Scores are 1 to 9 on the hedonic scale; age_days
 * is worked out from the journal's make date when the tasting is saved (and again if either
 * date changes), so Compare can relate each tasting to its make's parameters by journal_id.
 */
export const tastings = mysqlTable(
  'tastings',
  {
    id: int('id').autoincrement().primaryKey(),
    journalId: int('journal_id').notNull(),
    tasterId: int('taster_id').notNull(),
    tastedOn: date('tasted_on', { mode: 'string' }).notNull(),
    ageDays: int('age_days').notNull(),
    overall: tinyint('overall').notNull(),
    appearance: tinyint('appearance').notNull(),
    aroma: tinyint('aroma').notNull(),
    flavour: tinyint('flavour').notNull(),
    texture: tinyint('texture').notNull(),
    finish: tinyint('finish').notNull(),
    descriptors: jsonList('descriptors').notNull(),
    defects: jsonList('defects').notNull(),
    notes: mediumtext('notes').notNull(),
    hiddenAt: datetime('hidden_at', { mode: 'date' }),
    createdAt: datetime('created_at', { mode: 'date' })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP`),
    updatedAt: datetime('updated_at', { mode: 'date' })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP`)
      .$onUpdate(() => new Date()),
  },
  (t) => [
    foreignKey({
      name: 'tastings_journal_fk',
      columns: [t.journalId],
      foreignColumns: [journals.id],
    }).onDelete('cascade'),
    foreignKey({
      name: 'tastings_taster_fk',
      columns: [t.tasterId],
      foreignColumns: [users.id],
    }).onDelete('cascade'),
    index('tastings_journal_idx').on(t.journalId, t.tastedOn),
    // Compare reads every visible tasting of the matching journals: this index holds all it
    // needs (scores and age), so it never touches the rows.
    index('tastings_compare_idx').on(
      t.journalId,
      t.hiddenAt,
      t.overall,
      t.appearance,
      t.aroma,
      t.flavour,
      t.texture,
      t.finish,
      t.ageDays,
    ),
    index('tastings_taster_idx').on(t.tasterId),
    index('tastings_age_idx').on(t.ageDays),
  ],
);

/** A link the owner hands out at a meeting so other verified members can score the wheel. */
export const tastingInvites = mysqlTable(
  'tasting_invites',
  {
    id: int('id').autoincrement().primaryKey(),
    journalId: int('journal_id').notNull(),
    createdBy: int('created_by').notNull(),
    codeHash: char('code_hash', { length: 64 }).notNull(),
    expiresAt: datetime('expires_at', { mode: 'date' }).notNull(),
    createdAt: datetime('created_at', { mode: 'date' })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP`),
  },
  (t) => [
    uniqueIndex('tasting_invites_code_unique').on(t.codeHash),
    foreignKey({
      name: 'tasting_invites_journal_fk',
      columns: [t.journalId],
      foreignColumns: [journals.id],
    }).onDelete('cascade'),
    foreignKey({
      name: 'tasting_invites_user_fk',
      columns: [t.createdBy],
      foreignColumns: [users.id],
    }).onDelete('cascade'),
  ],
);

/**
 * One row per reminder that is due (ready date, or the maker's earlier check date). The
 * unique key makes "due" idempotent; sent_at is set in the same transaction that claims the
 * row (SELECT … FOR UPDATE SKIP LOCKED), so two app servers never send the same reminder.
 */
export const journalReminders = mysqlTable(
  'journal_reminders',
  {
    id: int('id').autoincrement().primaryKey(),
    journalId: int('journal_id').notNull(),
    kind: mysqlEnum('kind', ['ready', 'check']).notNull(),
    dueOn: date('due_on', { mode: 'string' }).notNull(),
    sentAt: datetime('sent_at', { mode: 'date' }),
    createdAt: datetime('created_at', { mode: 'date' })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP`),
  },
  (t) => [
    uniqueIndex('journal_reminders_unique').on(t.journalId, t.kind, t.dueOn),
    index('journal_reminders_pending_idx').on(t.sentAt, t.dueOn),
    foreignKey({
      name: 'journal_reminders_journal_fk',
      columns: [t.journalId],
      foreignColumns: [journals.id],
    }).onDelete('cascade'),
  ],
);

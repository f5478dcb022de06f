import {
  int,
  mysqlEnum,
  mysqlTable,
  text,
  uniqueIndex,
  varchar,
  index,
} from 'drizzle-orm/mysql-core';
import { STYLE_FAMILIES } from '../../../shared/constants/styles';

/** Reference table of cheese styles, kept in step with shared/constants/styles.ts at migrate time. */
export const styles = mysqlTable(
  'styles',
  {
    id: int('id').autoincrement().primaryKey(),
    slug: varchar('slug', { length: 64 }).notNull(),
    name: varchar('name', { length: 120 }).notNull(),
    family: mysqlEnum('family', STYLE_FAMILIES).notNull(),
    description: text('description').notNull(),
    typicalAgingDaysMin: int('typical_aging_days_min').notNull(),
    typicalAgingDaysMax: int('typical_aging_days_max').notNull(),
    sortOrder: int('sort_order').notNull().default(0),
  },
  (t) => [uniqueIndex('styles_slug_unique').on(t.slug), index('styles_family_idx').on(t.family)],
);

import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { sql } from 'drizzle-orm';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import { STYLES } from '../../shared/constants/styles';
import type { Database } from './client';
import { styles } from './schema';

const migrationsFolder = path.resolve(
  path.dirname(fileURLToPath(import.meta.url)),
  '../../migrations',
);

/** Applies every pending drizzle-kit migration, then brings reference data up to date. */
export async function migrateDatabase(db: Database): Promise<void> {
  await migrate(db, { migrationsFolder });
  await syncStyles(db);
}

/** Inserts or updates the reference styles from shared/constants/styles.ts. */
export async function syncStyles(db: Database): Promise<void> {
  const rows = STYLES.map((style, index) => ({
    slug: style.slug,
    name: style.name,
    family: style.family,
    description: style.description,
    typicalAgingDaysMin: style.agingDays[0],
    typicalAgingDaysMax: style.agingDays[1],
    sortOrder: index,
  }));
  await db
    .insert(styles)
    .values(rows)
    .onDuplicateKeyUpdate({
      set: {
        name: sql`VALUES(name)`,
        family: sql`VALUES(family)`,
        description: sql`VALUES(description)`,
        typicalAgingDaysMin: sql`VALUES(typical_aging_days_min)`,
        typicalAgingDaysMax: sql`VALUES(typical_aging_days_max)`,
        sortOrder: sql`VALUES(sort_order)`,
      },
    });
}

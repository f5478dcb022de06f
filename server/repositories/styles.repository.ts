import { asc } from 'drizzle-orm';
import type { Database } from '../db/client';
import { styles } from '../db/schema';

/** Every reference style in display order. */
export function listStyles(db: Database) {
  return db.select().from(styles).orderBy(asc(styles.sortOrder));
}

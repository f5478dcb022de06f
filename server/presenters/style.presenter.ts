import type { StyleDto } from '../../shared/types/style';
import type { styles } from '../db/schema';

/** Turns a styles row into its public DTO. */
export function presentStyle(row: typeof styles.$inferSelect): StyleDto {
  return {
    id: row.id,
    slug: row.slug,
    name: row.name,
    family: row.family,
    description: row.description,
    typicalAgingDays: { min: row.typicalAgingDaysMin, max: row.typicalAgingDaysMax },
  };
}

import { z } from 'zod';
import { COMPARE_OUTCOME_KEYS, COMPARE_PARAMETER_KEYS } from '../constants/compare';
import { journalListQuerySchema } from './journal';

const filters = journalListQuerySchema.pick({
  style: true,
  species: true,
  heat: true,
  rind: true,
  agingMin: true,
  agingMax: true,
  maker: true,
});

/**
 * GET /api/compare: a parameter, an outcome, the unit of a point, and Discover's filters.
 * A point is one batch (its tastings' mean) unless per=tasting asks for every scorecard:
 * tastings of one wheel are not independent, so counting each would make the interval too
 * narrow.
 */
export const compareQuerySchema = filters.extend({
  x: z.enum(COMPARE_PARAMETER_KEYS, {
    error: `Choose x from: ${COMPARE_PARAMETER_KEYS.join(', ')}.`,
  }),
  y: z.enum(COMPARE_OUTCOME_KEYS, { error: `Choose y from: ${COMPARE_OUTCOME_KEYS.join(', ')}.` }),
  per: z
    .enum(['tasting', 'journal'], { error: 'Choose per=tasting or per=journal.' })
    .default('journal'),
});

/** GET /api/compare/journals?ids=1,2,3: two to four journals side by side. */
export const compareJournalsQuerySchema = z.object({
  ids: z.preprocess(
    (v) => (typeof v === 'string' ? v.split(',').filter(Boolean).map(Number) : v),
    z
      .array(z.number().int().positive('Journal ids are positive whole numbers.'), {
        error: 'Give two to four journal ids, e.g. ids=3,8.',
      })
      .min(2, 'Pick at least two journals.')
      .max(4, 'Pick at most four journals.')
      .refine((ids) => new Set(ids).size === ids.length, 'Pick each journal once.'),
  ),
});

export type CompareQuery = z.infer<typeof compareQuerySchema>;

import {
  boolean,
  double,
  foreignKey,
  index,
  int,
  mysqlEnum,
  mysqlTable,
  primaryKey,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';
import { HEAT_TREATMENTS, RIND_TREATMENTS, SPECIES } from '../../../shared/constants/journal';
import { journals } from './journals';

/**
 * Compare's facts, one narrow row per journal: what its filters and privacy rule read (owner,
 * listed = published + public + not hidden, style, milk, heat, rind, aging), its title, the make's
 * metric_* figures, and the sums of its visible (not hidden) tastings. Written in the same
 * transaction as every change to the journal row or its tastings, by refreshCompareFacts in
 * server/repositories/compare.repository.ts; deleted with the journal (cascade).
 */
export const compareFacts = mysqlTable(
  'compare_facts',
  {
    journalId: int('journal_id').notNull(),
    userId: int('user_id').notNull(),
    listed: boolean('listed').notNull(),
    styleId: int('style_id').notNull(),
    species: mysqlEnum('species', SPECIES).notNull(),
    heatTreatment: mysqlEnum('heat_treatment', HEAT_TREATMENTS).notNull(),
    rindTreatment: mysqlEnum('rind_treatment', RIND_TREATMENTS).notNull(),
    /** The journal's title, for the chart's labels without a look-up in journals per point. */
    title: varchar('title', { length: 140 }).notNull().default(''),
    agingTargetDays: int('aging_target_days'),
    dryingDays: double('drying_days'),
    metricSaltGPerL: double('metric_salt_g_per_l'),
    metricSaltPercent: double('metric_salt_percent'),
    metricColourMlPerL: double('metric_colour_ml_per_l'),
    metricCalciumChlorideMlPerL: double('metric_calcium_chloride_ml_per_l'),
    metricCultureGPerL: double('metric_culture_g_per_l'),
    metricCoagulationTempC: double('metric_coagulation_temp_c'),
    metricCookTempC: double('metric_cook_temp_c'),
    metricCookRampCPer5Min: double('metric_cook_ramp_c_per_5min'),
    metricPressMaxKpa: double('metric_press_max_kpa'),
    metricYieldPercent: double('metric_yield_percent'),
    metricMoistureLossPercent: double('metric_moisture_loss_percent'),
    /** Visible tastings only, as everywhere in Compare. */
    tastingCount: int('tasting_count').notNull().default(0),
    firstTastedAgeDays: int('first_tasted_age_days'),
    lastTastedAgeDays: int('last_tasted_age_days'),
    ageSum: double('age_sum').notNull().default(0),
    ageSumSquares: double('age_sum_squares').notNull().default(0),
    // Per outcome: Σ, Σ of squares (whole numbers: scores are 1 to 9) and Σ (age at tasting ×
    // outcome) over the visible tastings, so every fit Compare draws adds up from these
    // instead of from the tastings.
    overallSum: int('overall_sum').notNull().default(0),
    overallSumSquares: int('overall_sum_squares').notNull().default(0),
    overallAgeSum: double('overall_age_sum').notNull().default(0),
    appearanceSum: int('appearance_sum').notNull().default(0),
    appearanceSumSquares: int('appearance_sum_squares').notNull().default(0),
    appearanceAgeSum: double('appearance_age_sum').notNull().default(0),
    aromaSum: int('aroma_sum').notNull().default(0),
    aromaSumSquares: int('aroma_sum_squares').notNull().default(0),
    aromaAgeSum: double('aroma_age_sum').notNull().default(0),
    flavourSum: int('flavour_sum').notNull().default(0),
    flavourSumSquares: int('flavour_sum_squares').notNull().default(0),
    flavourAgeSum: double('flavour_age_sum').notNull().default(0),
    textureSum: int('texture_sum').notNull().default(0),
    textureSumSquares: int('texture_sum_squares').notNull().default(0),
    textureAgeSum: double('texture_age_sum').notNull().default(0),
    finishSum: int('finish_sum').notNull().default(0),
    finishSumSquares: int('finish_sum_squares').notNull().default(0),
    finishAgeSum: double('finish_age_sum').notNull().default(0),
  },
  (t) => [
    foreignKey({
      name: 'compare_facts_journal_fk',
      columns: [t.journalId],
      foreignColumns: [journals.id],
    }).onDelete('cascade'),
    // The rows are stored in (listed, style, journal) order: everything anyone may count is
    // one range, and a style filter reads only its own style's rows, without a lookup per
    // row. A maker filter and the viewer's own journals read only that member's rows; the
    // chart sample looks journals up by id. Any other filter scans the listed range of this
    // narrow table, which is the worst case.
    primaryKey({ name: 'compare_facts_pk', columns: [t.listed, t.styleId, t.journalId] }),
    uniqueIndex('compare_facts_journal_unique').on(t.journalId),
    index('compare_facts_user_idx').on(t.userId, t.listed),
  ],
);

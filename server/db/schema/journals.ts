import { sql } from 'drizzle-orm';
import {
  boolean,
  char,
  date,
  datetime,
  double,
  foreignKey,
  index,
  int,
  mediumtext,
  mysqlEnum,
  mysqlTable,
  primaryKey,
  smallint,
  varchar,
} from 'drizzle-orm/mysql-core';
import {
  HEAT_TREATMENTS,
  INGREDIENT_KINDS,
  JOURNAL_STATUSES,
  MOULD_SHAPES,
  RIND_TREATMENTS,
  SPECIES,
  STEP_KINDS,
  VISIBILITIES,
  WHEEL_STATUSES,
} from '../../../shared/constants/journal';
import { AMOUNT_UNITS, FORCE_UNITS, LENGTH_UNITS, VOLUME_UNITS } from '../../../shared/trade/units';
import { styles } from './styles';
import { users } from './users';

const createdAt = () =>
  datetime('created_at', { mode: 'date' })
    .notNull()
    .default(sql`CURRENT_TIMESTAMP`);

/**
 * One batch (a make log). Measured values are SI. The metric_* columns are figures derived
 * with shared/trade when the journal is saved, kept here so Discover and Compare can filter
 * and aggregate in SQL; tasting_count, mean_overall and last_tasted_age_days are kept up to
 * date by the tastings service.
 */
export const journals = mysqlTable(
  'journals',
  {
    id: int('id').autoincrement().primaryKey(),
    userId: int('user_id').notNull(),
    styleId: int('style_id').notNull(),
    sourceJournalId: int('source_journal_id'),
    title: varchar('title', { length: 140 }).notNull(),
    makeDate: date('make_date', { mode: 'string' }).notNull(),
    status: mysqlEnum('status', JOURNAL_STATUSES).notNull().default('draft'),
    visibility: mysqlEnum('visibility', VISIBILITIES).notNull().default('private'),
    wheelStatus: mysqlEnum('wheel_status', WHEEL_STATUSES).notNull().default('making'),
    milkVolumeL: double('milk_volume_l').notNull(),
    milkVolumeUnit: mysqlEnum('milk_volume_unit', VOLUME_UNITS).notNull().default('L'),
    species: mysqlEnum('species', SPECIES).notNull(),
    heatTreatment: mysqlEnum('heat_treatment', HEAT_TREATMENTS).notNull(),
    homogenised: boolean('homogenised').notNull().default(false),
    fatPercent: double('fat_percent'),
    proteinPercent: double('protein_percent'),
    mouldShape: mysqlEnum('mould_shape', MOULD_SHAPES).notNull().default('round'),
    mouldDiameterMm: double('mould_diameter_mm'),
    mouldLengthMm: double('mould_length_mm'),
    mouldWidthMm: double('mould_width_mm'),
    mouldUnit: mysqlEnum('mould_unit', LENGTH_UNITS).notNull().default('mm'),
    rindTreatment: mysqlEnum('rind_treatment', RIND_TREATMENTS).notNull().default('natural'),
    dryingDays: double('drying_days'),
    agingTargetDays: int('aging_target_days'),
    agingTempC: double('aging_temp_c'),
    agingHumidityPercent: double('aging_humidity_percent'),
    agingCheckDate: date('aging_check_date', { mode: 'string' }),
    // The day the wheel was cut (set when it moves to opened or finished, or at the maker's
    // first tasting); ages of opened wheels stop there instead of running on.
    openedOn: date('opened_on', { mode: 'string' }),
    greenWeightKg: double('green_weight_kg'),
    notes: mediumtext('notes').notNull(),
    hiddenAt: datetime('hidden_at', { mode: 'date' }),
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
    tastingCount: int('tasting_count').notNull().default(0),
    meanOverall: double('mean_overall'),
    lastTastedAgeDays: int('last_tasted_age_days'),
    publishedAt: datetime('published_at', { mode: 'date' }),
    createdAt: createdAt(),
    updatedAt: datetime('updated_at', { mode: 'date' })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP`)
      .$onUpdate(() => new Date()),
  },
  (t) => [
    foreignKey({
      name: 'journals_user_fk',
      columns: [t.userId],
      foreignColumns: [users.id],
    }).onDelete('cascade'),
    foreignKey({ name: 'journals_style_fk', columns: [t.styleId], foreignColumns: [styles.id] }),
    foreignKey({
      name: 'journals_source_fk',
      columns: [t.sourceJournalId],
      foreignColumns: [t.id],
    }).onDelete('set null'),
    // Discover: what is listed is published + public + not hidden, so every listing index
    // starts with those three; then the sort (newest, best) or the filter to count (style,
    // aging), so a page is an ordered index scan that stops early and a count reads the
    // index only. Checked by tests/api/discover-explain.test.ts; measured by npm run bench.
    index('journals_listed_newest_idx').on(t.status, t.visibility, t.hiddenAt, t.makeDate),
    index('journals_listed_best_idx').on(
      t.status,
      t.visibility,
      t.hiddenAt,
      t.meanOverall,
      t.tastingCount,
    ),
    index('journals_listed_style_best_idx').on(
      t.status,
      t.visibility,
      t.hiddenAt,
      t.styleId,
      t.meanOverall,
      t.tastingCount,
    ),
    index('journals_listed_style_aging_idx').on(
      t.status,
      t.visibility,
      t.hiddenAt,
      t.styleId,
      t.agingTargetDays,
    ),
    index('journals_listed_aging_idx').on(t.status, t.visibility, t.hiddenAt, t.agingTargetDays),
    // Every other filter's count (milk, heat, rind, tasted age, score) reads this narrow
    // index instead of the rows.
    index('journals_listed_facets_idx').on(
      t.status,
      t.visibility,
      t.hiddenAt,
      t.species,
      t.heatTreatment,
      t.rindTreatment,
      t.lastTastedAgeDays,
      t.agingTargetDays,
      t.meanOverall,
    ),
    index('journals_style_idx').on(t.styleId, t.makeDate),
    index('journals_user_idx').on(t.userId, t.makeDate),
    index('journals_species_idx').on(t.species),
    index('journals_heat_idx').on(t.heatTreatment),
    index('journals_rind_idx').on(t.rindTreatment),
    index('journals_aging_target_idx').on(t.agingTargetDays),
    index('journals_tasted_age_idx').on(t.lastTastedAgeDays),
    index('journals_score_idx').on(t.meanOverall),
    index('journals_tasting_count_idx').on(t.tastingCount),
    index('journals_wheel_idx').on(t.userId, t.wheelStatus),
  ],
);

export const journalIngredients = mysqlTable(
  'journal_ingredients',
  {
    journalId: int('journal_id').notNull(),
    position: smallint('position').notNull(),
    kind: mysqlEnum('kind', INGREDIENT_KINDS).notNull(),
    name: varchar('name', { length: 80 }).notNull(),
    amount: double('amount').notNull(),
    unit: mysqlEnum('unit', AMOUNT_UNITS).notNull(),
    mlPerDrop: double('ml_per_drop'),
    /** The amount in SI: L (volume), kg (mass) or a count (drops). */
    siValue: double('si_value').notNull(),
    siDimension: mysqlEnum('si_dimension', ['volume', 'mass', 'count']).notNull(),
    note: varchar('note', { length: 300 }).notNull().default(''),
  },
  (t) => [
    primaryKey({ name: 'journal_ingredients_pk', columns: [t.journalId, t.position] }),
    foreignKey({
      name: 'journal_ingredients_journal_fk',
      columns: [t.journalId],
      foreignColumns: [journals.id],
    }).onDelete('cascade'),
    index('journal_ingredients_kind_idx').on(t.kind),
  ],
);

export const journalSteps = mysqlTable(
  'journal_steps',
  {
    journalId: int('journal_id').notNull(),
    position: smallint('position').notNull(),
    kind: mysqlEnum('kind', STEP_KINDS).notNull(),
    targetTempC: double('target_temp_c'),
    actualTempC: double('actual_temp_c'),
    targetMinutes: double('target_minutes'),
    actualMinutes: double('actual_minutes'),
    startedAt: datetime('started_at', { mode: 'date', fsp: 3 }),
    cutSizeMm: double('cut_size_mm'),
    note: varchar('note', { length: 500 }).notNull().default(''),
  },
  (t) => [
    primaryKey({ name: 'journal_steps_pk', columns: [t.journalId, t.position] }),
    foreignKey({
      name: 'journal_steps_journal_fk',
      columns: [t.journalId],
      foreignColumns: [journals.id],
    }).onDelete('cascade'),
  ],
);

export const journalPressStages = mysqlTable(
  'journal_press_stages',
  {
    journalId: int('journal_id').notNull(),
    position: smallint('position').notNull(),
    loadN: double('load_n').notNull(),
    loadUnit: mysqlEnum('load_unit', FORCE_UNITS).notNull().default('kgf'),
    minutes: int('minutes').notNull(),
  },
  (t) => [
    primaryKey({ name: 'journal_press_stages_pk', columns: [t.journalId, t.position] }),
    foreignKey({
      name: 'journal_press_stages_journal_fk',
      columns: [t.journalId],
      foreignColumns: [journals.id],
    }).onDelete('cascade'),
  ],
);

export const journalWeighIns = mysqlTable(
  'journal_weigh_ins',
  {
    id: int('id').autoincrement().primaryKey(),
    journalId: int('journal_id').notNull(),
    date: date('date', { mode: 'string' }).notNull(),
    massKg: double('mass_kg').notNull(),
    note: varchar('note', { length: 300 }).notNull().default(''),
  },
  (t) => [
    foreignKey({
      name: 'journal_weigh_ins_journal_fk',
      columns: [t.journalId],
      foreignColumns: [journals.id],
    }).onDelete('cascade'),
    index('journal_weigh_ins_journal_idx').on(t.journalId, t.date),
  ],
);

/** Readings logged at the vat; the id comes from the client, so a replayed write is a no-op. */
export const journalReadings = mysqlTable(
  'journal_readings',
  {
    id: char('id', { length: 36 }).primaryKey(),
    journalId: int('journal_id').notNull(),
    takenAt: datetime('taken_at', { mode: 'date', fsp: 3 }).notNull(),
    tempC: double('temp_c'),
    ph: double('ph'),
    stepIndex: smallint('step_index'),
    note: varchar('note', { length: 300 }).notNull().default(''),
    createdAt: createdAt(),
  },
  (t) => [
    foreignKey({
      name: 'journal_readings_journal_fk',
      columns: [t.journalId],
      foreignColumns: [journals.id],
    }).onDelete('cascade'),
    index('journal_readings_journal_idx').on(t.journalId, t.takenAt),
  ],
);

export const journalPhotos = mysqlTable(
  'journal_photos',
  {
    id: int('id').autoincrement().primaryKey(),
    journalId: int('journal_id').notNull(),
    /** Random base name of the stored files: KEY-320.webp, KEY-960.webp, KEY-1920.webp. */
    fileKey: varchar('file_key', { length: 64 }).notNull(),
    width: int('width').notNull(),
    height: int('height').notNull(),
    /** The rendition widths actually written (an image narrower than 1920 px gets fewer). */
    widths: varchar('widths', { length: 40 }).notNull(),
    caption: varchar('caption', { length: 200 }).notNull().default(''),
    position: smallint('position').notNull().default(0),
    hiddenAt: datetime('hidden_at', { mode: 'date' }),
    createdAt: createdAt(),
  },
  (t) => [
    foreignKey({
      name: 'journal_photos_journal_fk',
      columns: [t.journalId],
      foreignColumns: [journals.id],
    }).onDelete('cascade'),
    index('journal_photos_journal_idx').on(t.journalId, t.position),
    // /media/photos/KEY-W.webp finds its photo (and so its journal's visibility) by key.
    index('journal_photos_file_key_idx').on(t.fileKey),
  ],
);

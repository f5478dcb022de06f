import { z } from 'zod';
import { STYLES } from '../constants/styles';
import {
  HEAT_TREATMENTS,
  INGREDIENT_KINDS,
  JOURNAL_SORTS,
  JOURNAL_STATUSES,
  MOULD_SHAPES,
  RIND_TREATMENTS,
  SPECIES,
  STEP_KINDS,
  VISIBILITIES,
  WHEEL_STATUSES,
} from '../constants/journal';
import { AMOUNT_UNITS, FORCE_UNITS, LENGTH_UNITS, VOLUME_UNITS } from '../trade/units';

// The journal document as the editor sends it and the server validates it. Every measured
// value is in SI (L, kg, °C, mm, N, minutes); the unit the member typed is kept beside the
// values whose display needs it. Clients convert at the edge with shared/trade.

const isoDate = z
  .string({ error: 'Enter a date.' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-03-14.')
  .refine((v) => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)), 'That date does not exist.');

const optionalNumber = (min: number, max: number, what: string) =>
  z
    .number({ error: `${what} must be a number.` })
    .min(min, `${what} must be at least ${min}.`)
    .max(max, `${what} must be at most ${max}.`)
    .nullable()
    .default(null);

const tempC = (what: string) => optionalNumber(-10, 110, what);
const minutes = (what: string) =>
  z
    .number({ error: `${what} must be a number of minutes.` })
    .min(0, `${what} cannot be negative.`)
    .max(7 * 24 * 60, `${what} is longer than a week.`)
    .nullable()
    .default(null);

export const ingredientSchema = z.object({
  kind: z.enum(INGREDIENT_KINDS, { error: 'Choose what kind of ingredient this is.' }),
  name: z
    .string({ error: 'Name the ingredient.' })
    .trim()
    .min(1, 'Name the ingredient.')
    .max(80, 'Use at most 80 characters.'),
  amount: z
    .number({ error: 'Enter the amount.' })
    .positive('The amount must be more than zero.')
    .max(100_000, 'That amount is too large.'),
  unit: z.enum(AMOUNT_UNITS, { error: 'Choose a unit.' }),
  /** mL per drop, stated by the maker when the unit is drops (common assumption 0.05 mL). */
  mlPerDrop: z
    .number()
    .positive('mL per drop must be more than zero.')
    .max(1, 'A drop is less than 1 mL.')
    .nullable()
    .default(null),
  note: z.string().trim().max(300, 'Use at most 300 characters.').default(''),
});

export const stepSchema = z.object({
  kind: z.enum(STEP_KINDS, { error: 'Choose a step.' }),
  targetTempC: tempC('Target temperature'),
  actualTempC: tempC('Actual temperature'),
  targetMinutes: minutes('Target time'),
  actualMinutes: minutes('Actual time'),
  startedAt: z.iso
    .datetime({ offset: true, error: 'Use a date and time.' })
    .nullable()
    .default(null),
  cutSizeMm: optionalNumber(1, 100, 'Cut size'),
  note: z.string().trim().max(500, 'Use at most 500 characters.').default(''),
});

export const pressStageSchema = z.object({
  loadN: z
    .number({ error: 'Enter the load.' })
    .positive('The load must be more than zero.')
    .max(50_000, 'That load is more than 5 tonnes.'),
  loadUnit: z.enum(FORCE_UNITS).default('kgf'),
  minutes: z
    .number({ error: 'Enter the time.' })
    .int('Use whole minutes.')
    .positive('The time must be more than zero.')
    .max(7 * 24 * 60, 'Longer than a week.'),
});

export const weighInSchema = z.object({
  date: isoDate,
  massKg: z
    .number({ error: 'Enter the weight.' })
    .positive('The weight must be more than zero.')
    .max(500, 'That is heavier than 500 kg.'),
  note: z.string().trim().max(300, 'Use at most 300 characters.').default(''),
});

const styleSlugs = STYLES.map((s) => s.slug) as [string, ...string[]];

export const journalInputSchema = z
  .object({
    title: z
      .string({ error: 'Give the batch a title.' })
      .trim()
      .min(1, 'Give the batch a title.')
      .max(140, 'Use at most 140 characters.'),
    styleSlug: z.enum(styleSlugs, { error: 'Choose a style.' }),
    makeDate: isoDate,
    status: z.enum(JOURNAL_STATUSES).default('draft'),
    visibility: z.enum(VISIBILITIES, { error: 'Choose who can see it.' }).default('private'),
    wheelStatus: z.enum(WHEEL_STATUSES).default('making'),
    milk: z.object({
      volumeL: z
        .number({ error: 'Enter the milk volume.' })
        .positive('The milk volume must be more than zero.')
        .max(5000, 'That is more than 5000 L.'),
      volumeUnit: z.enum(VOLUME_UNITS).default('L'),
      species: z.enum(SPECIES, { error: 'Choose the milk.' }),
      heatTreatment: z.enum(HEAT_TREATMENTS, { error: 'Choose the heat treatment.' }),
      homogenised: z.boolean().default(false),
      fatPercent: optionalNumber(0, 20, 'Fat'),
      proteinPercent: optionalNumber(0, 15, 'Protein'),
    }),
    mould: z
      .object({
        shape: z.enum(MOULD_SHAPES).default('round'),
        diameterMm: optionalNumber(10, 1000, 'Diameter'),
        lengthMm: optionalNumber(10, 1000, 'Length'),
        widthMm: optionalNumber(10, 1000, 'Width'),
        unit: z.enum(LENGTH_UNITS).default('mm'),
      })
      .default({ shape: 'round', diameterMm: null, lengthMm: null, widthMm: null, unit: 'mm' }),
    rindTreatment: z
      .enum(RIND_TREATMENTS, { error: 'Choose a rind treatment.' })
      .default('natural'),
    dryingDays: optionalNumber(0, 120, 'Drying days'),
    aging: z
      .object({
        targetDays: z
          .number()
          .int('Use whole days.')
          .min(0, 'Days cannot be negative.')
          .max(3650, 'More than ten years.')
          .nullable()
          .default(null),
        tempC: optionalNumber(-5, 30, 'Cave temperature'),
        humidityPercent: optionalNumber(0, 100, 'Humidity'),
        checkDate: isoDate.nullable().default(null),
      })
      .default({ targetDays: null, tempC: null, humidityPercent: null, checkDate: null }),
    greenWeightKg: optionalNumber(0.01, 500, 'Green weight'),
    notes: z.string().max(20_000, 'Use at most 20000 characters.').default(''),
    ingredients: z.array(ingredientSchema).max(40, 'At most 40 ingredients.').default([]),
    steps: z.array(stepSchema).max(60, 'At most 60 steps.').default([]),
    pressStages: z.array(pressStageSchema).max(20, 'At most 20 press stages.').default([]),
    weighIns: z.array(weighInSchema).max(200, 'At most 200 weigh-ins.').default([]),
  })
  .superRefine((j, ctx) => {
    if (
      j.mould.shape === 'rectangular' &&
      (j.mould.lengthMm === null) !== (j.mould.widthMm === null)
    ) {
      ctx.addIssue({
        code: 'custom',
        path: ['mould', 'widthMm'],
        message: 'Give both length and width, or neither.',
      });
    }
    j.ingredients.forEach((ing, i) => {
      if (ing.unit === 'drop' && ing.mlPerDrop === null) {
        ctx.addIssue({
          code: 'custom',
          path: ['ingredients', i, 'mlPerDrop'],
          message: 'Say how many mL a drop is (0.05 mL is a common assumption).',
        });
      }
    });
    if (j.pressStages.length && j.mould.diameterMm === null && j.mould.lengthMm === null) {
      ctx.addIssue({
        code: 'custom',
        path: ['mould', 'diameterMm'],
        message: 'Give the mould size so the pressure on the curd can be worked out.',
      });
    }
  });

export type JournalInput = z.infer<typeof journalInputSchema>;
export type JournalInputDraft = z.input<typeof journalInputSchema>;

/** A reading logged at the vat; the client makes the id so a replay is stored once. */
export const readingInputSchema = z
  .object({
    id: z.uuid({ error: 'A reading needs a client id (UUID).' }),
    takenAt: z.iso.datetime({ offset: true, error: 'Use a date and time.' }),
    tempC: tempC('Temperature'),
    ph: optionalNumber(3, 8, 'pH'),
    stepIndex: z.number().int().min(0).max(59).nullable().default(null),
    note: z.string().trim().max(300).default(''),
  })
  .refine((r) => r.tempC !== null || r.ph !== null, {
    message: 'Record a temperature, a pH, or both.',
    path: ['tempC'],
  });

export const copyJournalSchema = z.object({
  milkVolume: z
    .number({ error: 'Enter your milk volume.' })
    .positive('The milk volume must be more than zero.')
    .max(5000),
  unit: z.enum(VOLUME_UNITS, { error: 'Choose a unit.' }),
});

const csv = <T extends readonly [string, ...string[]]>(values: T) =>
  z.preprocess(
    (v) =>
      typeof v === 'string'
        ? v.split(',').filter(Boolean)
        : Array.isArray(v)
          ? v
          : v === undefined
            ? undefined
            : [v],
    z.array(z.enum(values)).max(values.length).optional(),
  );

/** Discover's filters, as query-string values. */
export const journalListQuerySchema = z.object({
  style: csv(styleSlugs),
  species: csv(SPECIES),
  heat: csv(HEAT_TREATMENTS),
  rind: csv(RIND_TREATMENTS),
  agingMin: z.coerce.number().int().min(0).max(3650).optional(),
  agingMax: z.coerce.number().int().min(0).max(3650).optional(),
  /** 'target' filters on the aging target, 'tasted' on the age at the latest tasting. */
  agingBy: z.enum(['target', 'tasted']).default('target'),
  minScore: z.coerce.number().min(1).max(9).optional(),
  maker: z.string().trim().toLowerCase().max(32).optional(),
  q: z.string().trim().max(200).optional(),
  sort: z.enum(JOURNAL_SORTS).default('newest'),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(24),
  /** Only the caller's own journals, drafts and private ones included. */
  mine: z
    .enum(['true', 'false'])
    .transform((v) => v === 'true')
    .optional(),
});

export type JournalListQuery = z.infer<typeof journalListQuerySchema>;

/** A batch of readings from the vat's offline queue; each is stored once by its client id. */
export const readingBatchSchema = z.object({
  readings: z
    .array(readingInputSchema)
    .min(1, 'Send at least one reading.')
    .max(500, 'Send at most 500 readings at a time.'),
});

export const JOURNAL_EXPORT_TABLES = [
  'journals',
  'ingredients',
  'steps',
  'press-stages',
  'weigh-ins',
  'readings',
  'photos',
] as const;
export type JournalExportTable = (typeof JOURNAL_EXPORT_TABLES)[number];

/** The export of a member's own journals: JSON with everything, or CSV one table at a time. */
export const journalExportQuerySchema = z.object({
  format: z.enum(['csv', 'json'], { error: 'Choose csv or json.' }).default('json'),
  /** CSV only: journals (one row each, the default) or one of the child tables. */
  table: z.enum(JOURNAL_EXPORT_TABLES, { error: 'Choose a table to export.' }).default('journals'),
});

import { sql, type SQL } from 'drizzle-orm';
import type { CompareOutcomeKey, CompareParameterKey } from '../../shared/constants/compare';
import type { Database } from '../db/client';
import type { RegressionSums } from '../../shared/trade/stats';

type Db = Database | Parameters<Parameters<Database['transaction']>[0]>[0];

// --- keeping compare_facts up to date ------------------------------------------------------

// The journal columns compare_facts copies as they are.
const COPIED = [
  'user_id',
  'style_id',
  'species',
  'heat_treatment',
  'rind_treatment',
  'title',
  'aging_target_days',
  'drying_days',
  'metric_salt_g_per_l',
  'metric_salt_percent',
  'metric_colour_ml_per_l',
  'metric_calcium_chloride_ml_per_l',
  'metric_culture_g_per_l',
  'metric_coagulation_temp_c',
  'metric_cook_temp_c',
  'metric_cook_ramp_c_per_5min',
  'metric_press_max_kpa',
  'metric_yield_percent',
  'metric_moisture_loss_percent',
] as const;

const OUTCOMES = ['overall', 'appearance', 'aroma', 'flavour', 'texture', 'finish'] as const;

// The tasting sums: [column, expression over the journal's visible tastings, empty value].
const TASTING_SUMS: [string, string, string][] = [
  ['tasting_count', 'COUNT(*)', '0'],
  ['first_tasted_age_days', 'MIN(age_days)', 'NULL'],
  ['last_tasted_age_days', 'MAX(age_days)', 'NULL'],
  ['age_sum', 'SUM(age_days)', '0'],
  ['age_sum_squares', 'SUM(age_days * age_days)', '0'],
  ...OUTCOMES.flatMap((o): [string, string, string][] => [
    [`${o}_sum`, `SUM(${o})`, '0'],
    [`${o}_sum_squares`, `SUM(${o} * ${o})`, '0'],
    [`${o}_age_sum`, `SUM(age_days * ${o})`, '0'],
  ]),
];

const FACT_COLUMNS = ['listed', ...COPIED, ...TASTING_SUMS.map(([c]) => c)];

/**
 * The statement that writes compare_facts from journals and tastings (the same one the
 * migration backfilled with): `journals` narrows the journals, `tastings` the tastings read.
 * Listed means what everyone may count: published, public and not hidden (the viewer's own
 * count for the viewer whatever this says). Only visible tastings are summed.
 */
function factsInsert(journals: SQL, tastings: SQL): SQL {
  const sums = TASTING_SUMS.map(([c, expr]) => `${expr} AS ${c}`).join(', ');
  const picked = [
    `j.status = 'published' AND j.visibility = 'public' AND j.hidden_at IS NULL`,
    ...COPIED.map((c) => `j.${c}`),
    ...TASTING_SUMS.map(([c, , empty]) => (empty === 'NULL' ? `s.${c}` : `COALESCE(s.${c}, 0)`)),
  ].join(', ');
  return sql`
    INSERT INTO compare_facts (journal_id, ${sql.raw(FACT_COLUMNS.join(', '))})
    SELECT j.id, ${sql.raw(picked)}
    FROM journals j LEFT JOIN (
      SELECT journal_id, ${sql.raw(sums)} FROM tastings
      WHERE hidden_at IS NULL AND ${tastings} GROUP BY journal_id
    ) s ON s.journal_id = j.id
    WHERE ${journals}`;
}

/**
 * Rewrites one journal's compare_facts row from its journal row and visible tastings. Call it
 * in the transaction of every write that changes either (a deleted journal's row cascades).
 * Delete and insert, since the row's place (listed, style) may change with it.
 */
export async function refreshCompareFacts(db: Db, journalId: number): Promise<void> {
  await db.execute(sql`DELETE FROM compare_facts WHERE journal_id = ${journalId}`);
  await db.execute(factsInsert(sql`j.id = ${journalId}`, sql`journal_id = ${journalId}`));
}

/** Rewrites every journal's compare_facts row (after a bulk load, or to repair), in one transaction. */
export async function rebuildCompareFacts(db: Db): Promise<void> {
  await db.transaction(async (tx) => {
    await tx.execute(sql`DELETE FROM compare_facts`);
    await tx.execute(factsInsert(sql`TRUE`, sql`TRUE`));
  });
}

// --- reading -------------------------------------------------------------------------------

// Column expressions for every Compare key (aliases: f compare_facts, t tastings, s styles).
const JOURNAL_X: Partial<Record<CompareParameterKey, SQL>> = {
  saltPerLitre: sql`f.metric_salt_g_per_l`,
  saltPercent: sql`f.metric_salt_percent`,
  colourPerLitre: sql`f.metric_colour_ml_per_l`,
  calciumChloridePerLitre: sql`f.metric_calcium_chloride_ml_per_l`,
  culturePerLitre: sql`f.metric_culture_g_per_l`,
  coagulationTemp: sql`f.metric_coagulation_temp_c`,
  cookTemp: sql`f.metric_cook_temp_c`,
  cookRamp: sql`f.metric_cook_ramp_c_per_5min`,
  pressMaxKpa: sql`f.metric_press_max_kpa`,
  dryingDays: sql`f.drying_days`,
  yieldPercent: sql`f.metric_yield_percent`,
  style: sql`s.slug`,
  species: sql`f.species`,
  heatTreatment: sql`f.heat_treatment`,
  rindTreatment: sql`f.rind_treatment`,
};

const CATEGORY_KEYS = new Set<CompareParameterKey>([
  'style',
  'species',
  'heatTreatment',
  'rindTreatment',
]);

const TASTING_OUTCOMES = new Set<CompareOutcomeKey>(OUTCOMES);

const JOURNAL_Y: Partial<Record<CompareOutcomeKey, SQL>> = {
  yieldPercent: sql`f.metric_yield_percent`,
  moistureLossPercent: sql`f.metric_moisture_loss_percent`,
};

export type CompareFilter = {
  viewerId?: number;
  styleIds?: number[];
  species?: string[];
  heat?: string[];
  rind?: string[];
  agingMin?: number;
  agingMax?: number;
  makerId?: number;
};

export type CompareRow = {
  x: number | string;
  y: number;
  journalId: number;
  title: string;
  maker: string;
  tastingId: number | null;
};

const list = (values: readonly (string | number)[]) =>
  sql.join(
    values.map((v) => sql`${v}`),
    sql`, `,
  );

// Whose journals count: the listed ones (published, public, not hidden) for everyone, and
// the viewer's own for the viewer. 'listed' and 'own' split the same set in two, so each
// half can use its own index.
type Privacy = 'all' | 'listed' | 'own';

function conditions(f: CompareFilter, privacy: Privacy = 'all'): SQL {
  const parts: SQL[] = [];
  if (privacy === 'own') parts.push(sql`f.user_id = ${f.viewerId ?? -1} AND f.listed = 0`);
  else if (privacy === 'listed' || !f.viewerId) parts.push(sql`f.listed = 1`);
  else parts.push(sql`(f.listed = 1 OR f.user_id = ${f.viewerId})`);
  if (f.styleIds?.length) parts.push(sql`f.style_id IN (${list(f.styleIds)})`);
  if (f.species?.length) parts.push(sql`f.species IN (${list(f.species)})`);
  if (f.heat?.length) parts.push(sql`f.heat_treatment IN (${list(f.heat)})`);
  if (f.rind?.length) parts.push(sql`f.rind_treatment IN (${list(f.rind)})`);
  if (f.agingMin !== undefined) parts.push(sql`f.aging_target_days >= ${f.agingMin}`);
  if (f.agingMax !== undefined) parts.push(sql`f.aging_target_days <= ${f.agingMax}`);
  if (f.makerId !== undefined) parts.push(sql`f.user_id = ${f.makerId}`);
  return sql.join(parts, sql` AND `);
}

/**
 * How one comparison's points are made: one per visible tasting (unit 'tasting', facts joined
 * to tastings) or one per journal (unit 'journal', from the facts alone: the mean of the
 * journal's visible tastings, or a journal-level outcome), with the condition for a point.
 */
type Shape = { unit: 'tasting' | 'journal'; x: SQL; y: SQL; present: SQL };

function shapeOf(x: CompareParameterKey, y: CompareOutcomeKey, per: 'tasting' | 'journal'): Shape {
  const journalX = JOURNAL_X[x];
  if (TASTING_OUTCOMES.has(y)) {
    const o = sql.raw(y);
    if (per === 'tasting') {
      const xExpr = x === 'ageDays' ? sql`t.age_days` : journalX!;
      return {
        unit: 'tasting',
        x: xExpr,
        y: sql`t.${o}`,
        present:
          x === 'ageDays'
            ? sql`f.tasting_count > 0`
            : sql`f.tasting_count > 0 AND ${xExpr} IS NOT NULL`,
      };
    }
    const xExpr = x === 'ageDays' ? sql`f.age_sum / f.tasting_count` : journalX!;
    // `* 1e0` makes the mean a DOUBLE: an integer sum over an integer count is a DECIMAL in
    // MariaDB, and the regression's sums of its products then run in decimal arithmetic,
    // about 2.5 times slower over the whole community (measured: 190 ms against 73 ms for
    // 78,000 journals, bench/ in the README).
    return {
      unit: 'journal',
      x: xExpr,
      y: sql`f.${sql.raw(`${y}_sum`)} * 1e0 / f.tasting_count`,
      present: sql`f.tasting_count > 0 AND ${xExpr} IS NOT NULL`,
    };
  }
  const yExpr = JOURNAL_Y[y]!;
  const xExpr = x === 'ageDays' ? sql`f.last_tasted_age_days` : journalX!;
  return {
    unit: 'journal',
    x: xExpr,
    y: yExpr,
    present: sql`${xExpr} IS NOT NULL AND ${yExpr} IS NOT NULL`,
  };
}

type PointsOptions = {
  /** With the journal's title and maker's handle (the chart's labels); categories skip them. */
  names: boolean;
  /** Only the points of every step-th journal by id (the ids to try, when few enough). */
  sample?: { step: number; ids?: number[] };
  limit: number;
};

function pointsQuery(
  x: CompareParameterKey,
  y: CompareOutcomeKey,
  per: 'tasting' | 'journal',
  filter: CompareFilter,
  opts: PointsOptions,
): SQL {
  const shape = shapeOf(x, y, per);
  const where = [shape.present, conditions(filter)];
  if (opts.sample) {
    where.push(sql`MOD(f.journal_id, ${opts.sample.step}) = 0`);
    if (opts.sample.ids) where.push(sql`f.journal_id IN (${list(opts.sample.ids)})`);
  }
  const joins = [
    shape.unit === 'tasting'
      ? sql`JOIN tastings t ON t.journal_id = f.journal_id AND t.hidden_at IS NULL`
      : sql``,
    opts.names ? sql`JOIN users u ON u.id = f.user_id` : sql``,
    x === 'style' ? sql`JOIN styles s ON s.id = f.style_id` : sql``,
  ];
  const tastingId = shape.unit === 'tasting' ? sql`t.id` : sql`NULL`;
  // MariaDB turns an IN list of 1,000 values or more into a derived table it joins against a
  // scan of the facts (in_predicate_conversion_threshold); for the sample's ids, looking each
  // one up in compare_facts_journal_unique is four times faster (153 ms against 39 ms for
  // 2,500 ids over 100,000 journals).
  const prefix = opts.sample?.ids
    ? sql`SET STATEMENT in_predicate_conversion_threshold = 0 FOR `
    : sql``;
  // The facts first, always: the optimizer otherwise may start from users and
  // look the facts up per maker, reading far more rows than the filter matches.
  return sql`
    ${prefix}SELECT STRAIGHT_JOIN ${shape.x} AS x, ${shape.y} AS y, f.journal_id AS journalId,
           ${opts.names ? sql`f.title` : sql`NULL`} AS title,
           ${opts.names ? sql`u.handle` : sql`NULL`} AS maker, ${tastingId} AS tastingId
    FROM compare_facts f ${sql.join(joins, sql` `)}
    WHERE ${sql.join(where, sql` AND `)}
    ORDER BY f.journal_id${shape.unit === 'tasting' ? sql`, t.id` : sql``}
    LIMIT ${opts.limit}`;
}

const toRow = (x: CompareParameterKey) => (r: CompareRow) => ({
  x: CATEGORY_KEYS.has(x) ? String(r.x) : Number(r.x),
  y: Number(r.y),
  journalId: Number(r.journalId),
  title: r.title,
  maker: r.maker,
  tastingId: r.tastingId === null ? null : Number(r.tastingId),
});

/**
 * The points of one comparison in journal and tasting order, at most `limit`: one per visible
 * tasting, or one per journal with the mean of its visible tastings. Without names, title and
 * maker are null (the categories need only x and y).
 */
export async function comparePoints(
  db: Db,
  x: CompareParameterKey,
  y: CompareOutcomeKey,
  per: 'tasting' | 'journal',
  filter: CompareFilter,
  { names = true, limit = 200_000 }: { names?: boolean; limit?: number } = {},
): Promise<CompareRow[]> {
  const [rows] = await db.execute(pointsQuery(x, y, per, filter, { names, limit }));
  return (rows as unknown as CompareRow[]).map(toRow(x));
}

/** RegressionSums with the span of journal ids that have points (for the chart sample). */
export type CompareSums = RegressionSums & {
  /** How many journals have points, and the first and last of their ids. */
  journals: number;
  firstJournalId: number;
  lastJournalId: number;
};

// The sums' SELECT list over the facts. Per tasting, each journal's tastings are added up
// already: n = Σ count, Σx = Σ x·count, Σxy = Σ x·Σy and so on; per journal, the usual sums
// over one point per row.
function sumsSelect(x: CompareParameterKey, y: CompareOutcomeKey, per: 'tasting' | 'journal') {
  const shape = shapeOf(x, y, per);
  const ids = sql`COUNT(*) AS journals, MIN(f.journal_id) AS firstJournalId, MAX(f.journal_id) AS lastJournalId`;
  if (shape.unit === 'journal') {
    const { x: X, y: Y } = shape;
    return sql`COUNT(*) AS n, SUM(${X}) AS sumX, SUM(${Y}) AS sumY, SUM(${X} * ${X}) AS sumXX,
      SUM(${X} * ${Y}) AS sumXY, SUM(${Y} * ${Y}) AS sumYY, MIN(${X}) AS minX, MAX(${X}) AS maxX, ${ids}`;
  }
  const c = sql`f.tasting_count`;
  const sy = sql.raw(`f.${y}_sum`);
  const syy = sql.raw(`f.${y}_sum_squares`);
  if (x === 'ageDays') {
    return sql`SUM(${c}) AS n, SUM(f.age_sum) AS sumX, SUM(${sy}) AS sumY,
      SUM(f.age_sum_squares) AS sumXX, SUM(${sql.raw(`f.${y}_age_sum`)}) AS sumXY,
      SUM(${syy}) AS sumYY, MIN(f.first_tasted_age_days) AS minX,
      MAX(f.last_tasted_age_days) AS maxX, ${ids}`;
  }
  const X = shape.x;
  return sql`SUM(${c}) AS n, SUM(${X} * ${c}) AS sumX, SUM(${sy}) AS sumY,
    SUM(${X} * ${X} * ${c}) AS sumXX, SUM(${X} * ${sy}) AS sumXY, SUM(${syy}) AS sumYY,
    MIN(${X}) AS minX, MAX(${X}) AS maxX, ${ids}`;
}

const EMPTY: CompareSums = {
  n: 0,
  sumX: 0,
  sumY: 0,
  sumXX: 0,
  sumXY: 0,
  sumYY: 0,
  minX: 0,
  maxX: 0,
  journals: 0,
  firstJournalId: 0,
  lastJournalId: 0,
};

function addSums(a: CompareSums, b: CompareSums): CompareSums {
  if (!a.n) return b;
  if (!b.n) return a;
  return {
    n: a.n + b.n,
    sumX: a.sumX + b.sumX,
    sumY: a.sumY + b.sumY,
    sumXX: a.sumXX + b.sumXX,
    sumXY: a.sumXY + b.sumXY,
    sumYY: a.sumYY + b.sumYY,
    minX: Math.min(a.minX, b.minX),
    maxX: Math.max(a.maxX, b.maxX),
    journals: a.journals + b.journals,
    firstJournalId: Math.min(a.firstJournalId, b.firstJournalId),
    lastJournalId: Math.max(a.lastJournalId, b.lastJournalId),
  };
}

/**
 * The count and sums of a numeric comparison over every point, added up from compare_facts
 * (one row per journal, never the tastings). For a signed-in viewer, the listed journals and
 * the viewer's own unlisted ones are added up apart (each half reads its own index).
 */
export async function compareSums(
  db: Db,
  x: CompareParameterKey,
  y: CompareOutcomeKey,
  per: 'tasting' | 'journal',
  filter: CompareFilter,
): Promise<CompareSums> {
  const shape = shapeOf(x, y, per);
  const halves: Privacy[] = filter.viewerId ? ['listed', 'own'] : ['listed'];
  let total = EMPTY;
  for (const half of halves) {
    const [rows] = await db.execute(sql`
      SELECT ${sumsSelect(x, y, per)} FROM compare_facts f
      WHERE ${shape.present} AND ${conditions(filter, half)}`);
    const [r] = rows as unknown as Record<keyof CompareSums, number | string | null>[];
    const num = (v: number | string | null) => Number(v ?? 0);
    total = addSums(total, {
      n: num(r.n),
      sumX: num(r.sumX),
      sumY: num(r.sumY),
      sumXX: num(r.sumXX),
      sumXY: num(r.sumXY),
      sumYY: num(r.sumYY),
      minX: num(r.minX),
      maxX: num(r.maxX),
      journals: num(r.journals),
      firstJournalId: num(r.firstJournalId),
      lastJournalId: num(r.lastJournalId),
    });
  }
  return total;
}

/** Beyond this many candidate ids, the sample scans the matching facts instead. */
const MAX_SAMPLE_IDS = 4000;

/**
 * At most about `limit` of a comparison's points for the chart, spread over the whole set:
 * the points of every step-th journal by id, step = ⌈n / limit⌉ (a whole journal's tastings
 * together). When the multiples of step between the first and last journal with points are
 * few, only those journals are looked up by id; with a style filter (its rows are one range
 * of the table) they are looked up only if far fewer than the style's journals, since a
 * look-up costs several rows of a scan.
 */
export async function compareSample(
  db: Db,
  x: CompareParameterKey,
  y: CompareOutcomeKey,
  per: 'tasting' | 'journal',
  filter: CompareFilter,
  sums: Pick<CompareSums, 'n' | 'journals' | 'firstJournalId' | 'lastJournalId'>,
  limit: number,
): Promise<CompareRow[]> {
  if (!sums.n) return [];
  const step = Math.max(1, Math.ceil(sums.n / limit));
  const from = Math.ceil(sums.firstJournalId / step) * step;
  const count = Math.max(0, Math.floor((sums.lastJournalId - from) / step) + 1);
  if (!count) return [];
  const lookUp = count <= MAX_SAMPLE_IDS && !(filter.styleIds?.length && count * 8 > sums.journals);
  const ids = lookUp ? Array.from({ length: count }, (_, i) => from + i * step) : undefined;
  const [rows] = await db.execute(
    pointsQuery(x, y, per, filter, { names: true, sample: { step, ids }, limit }),
  );
  return (rows as unknown as CompareRow[]).map(toRow(x));
}

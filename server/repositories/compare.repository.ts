import { sql, type SQL } from 'drizzle-orm';
import type { CompareOutcomeKey, CompareParameterKey } from '../../shared/constants/compare';
import type { Database } from '../db/client';
import type { RegressionSums } from '../../shared/trade/stats';

// Column expressions for every Compare key (aliases: j journals, t tastings, s styles, u users).
const JOURNAL_X: Partial<Record<CompareParameterKey, SQL>> = {
  saltPerLitre: sql`j.metric_salt_g_per_l`,
  saltPercent: sql`j.metric_salt_percent`,
  colourPerLitre: sql`j.metric_colour_ml_per_l`,
  calciumChloridePerLitre: sql`j.metric_calcium_chloride_ml_per_l`,
  culturePerLitre: sql`j.metric_culture_g_per_l`,
  coagulationTemp: sql`j.metric_coagulation_temp_c`,
  cookTemp: sql`j.metric_cook_temp_c`,
  cookRamp: sql`j.metric_cook_ramp_c_per_5min`,
  pressMaxKpa: sql`j.metric_press_max_kpa`,
  dryingDays: sql`j.drying_days`,
  yieldPercent: sql`j.metric_yield_percent`,
  style: sql`s.slug`,
  species: sql`j.species`,
  heatTreatment: sql`j.heat_treatment`,
  rindTreatment: sql`j.rind_treatment`,
};

const CATEGORY_KEYS = new Set<CompareParameterKey>([
  'style',
  'species',
  'heatTreatment',
  'rindTreatment',
]);

const TASTING_Y: Partial<Record<CompareOutcomeKey, SQL>> = {
  overall: sql`t.overall`,
  appearance: sql`t.appearance`,
  aroma: sql`t.aroma`,
  flavour: sql`t.flavour`,
  texture: sql`t.texture`,
  finish: sql`t.finish`,
};

const JOURNAL_Y: Partial<Record<CompareOutcomeKey, SQL>> = {
  yieldPercent: sql`j.metric_yield_percent`,
  moistureLossPercent: sql`j.metric_moisture_loss_percent`,
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

function conditions(f: CompareFilter): SQL {
  // Public, published, unhidden journals count; the viewer's own count for the viewer.
  const parts: SQL[] = [
    f.viewerId
      ? sql`((j.status = 'published' AND j.visibility = 'public' AND j.hidden_at IS NULL) OR j.user_id = ${f.viewerId})`
      : sql`(j.status = 'published' AND j.visibility = 'public' AND j.hidden_at IS NULL)`,
  ];
  if (f.styleIds?.length) parts.push(sql`j.style_id IN (${list(f.styleIds)})`);
  if (f.species?.length) parts.push(sql`j.species IN (${list(f.species)})`);
  if (f.heat?.length) parts.push(sql`j.heat_treatment IN (${list(f.heat)})`);
  if (f.rind?.length) parts.push(sql`j.rind_treatment IN (${list(f.rind)})`);
  if (f.agingMin !== undefined) parts.push(sql`j.aging_target_days >= ${f.agingMin}`);
  if (f.agingMax !== undefined) parts.push(sql`j.aging_target_days <= ${f.agingMax}`);
  if (f.makerId !== undefined) parts.push(sql`j.user_id = ${f.makerId}`);
  return sql.join(parts, sql` AND `);
}

type Shape = { names: boolean };

// The SELECT of one comparison's points, without order or limit: one row per visible
// tasting, or one per journal with the mean of its visible tastings. Without names, the
// users join is left out (every journal has a maker, so the rows are the same) and styles is
// joined only when a filter or x needs it.
function pointsQuery(
  x: CompareParameterKey,
  y: CompareOutcomeKey,
  per: 'tasting' | 'journal',
  filter: CompareFilter,
  shape: Shape,
): SQL {
  const where = conditions(filter);
  const maker = shape.names ? sql`u.handle` : sql`NULL`;
  const joins = sql.join(
    [
      shape.names ? sql`JOIN users u ON u.id = j.user_id` : sql``,
      shape.names || x === 'style' ? sql`JOIN styles s ON s.id = j.style_id` : sql``,
    ],
    sql` `,
  );
  const tastingY = TASTING_Y[y];
  if (tastingY) {
    const xExpr = x === 'ageDays' ? sql`t.age_days` : JOURNAL_X[x]!;
    return per === 'tasting'
      ? sql`SELECT ${xExpr} AS x, ${tastingY} AS y, j.id AS journalId, j.title AS title, ${maker} AS maker, t.id AS tastingId
              FROM tastings t JOIN journals j ON j.id = t.journal_id ${joins}
              WHERE t.hidden_at IS NULL AND ${xExpr} IS NOT NULL AND ${where}`
      : sql`SELECT ${x === 'ageDays' ? sql`AVG(t.age_days)` : sql`MIN(${xExpr})`} AS x, AVG(${tastingY}) AS y, j.id AS journalId, MIN(j.title) AS title, MIN(${maker}) AS maker, NULL AS tastingId
              FROM tastings t JOIN journals j ON j.id = t.journal_id ${joins}
              WHERE t.hidden_at IS NULL AND ${xExpr} IS NOT NULL AND ${where}
              GROUP BY j.id`;
  }
  const yExpr = JOURNAL_Y[y]!;
  const xExpr = x === 'ageDays' ? sql`j.last_tasted_age_days` : JOURNAL_X[x]!;
  return sql`SELECT ${xExpr} AS x, ${yExpr} AS y, j.id AS journalId, j.title AS title, ${maker} AS maker, NULL AS tastingId
              FROM journals j ${joins}
              WHERE ${xExpr} IS NOT NULL AND ${yExpr} IS NOT NULL AND ${where}`;
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
 * The points of one comparison, filtered and (per journal) aggregated in SQL: one row per
 * visible tasting, or one per journal with the mean of its visible tastings.
 */
export async function comparePoints(
  db: Database,
  x: CompareParameterKey,
  y: CompareOutcomeKey,
  per: 'tasting' | 'journal',
  filter: CompareFilter,
): Promise<CompareRow[]> {
  const inner = pointsQuery(x, y, per, filter, { names: true });
  const [rows] = await db.execute(
    sql`SELECT * FROM (${inner}) q ORDER BY q.journalId, q.tastingId LIMIT 200000`,
  );
  return (rows as unknown as CompareRow[]).map(toRow(x));
}

/** The count and sums of a numeric comparison over every point, added up in SQL. */
export async function compareSums(
  db: Database,
  x: CompareParameterKey,
  y: CompareOutcomeKey,
  per: 'tasting' | 'journal',
  filter: CompareFilter,
): Promise<RegressionSums> {
  const inner = pointsQuery(x, y, per, filter, { names: false });
  const [rows] = await db.execute(sql`
    SELECT COUNT(*) AS n, SUM(q.x) AS sumX, SUM(q.y) AS sumY, SUM(q.x * q.x) AS sumXX,
           SUM(q.x * q.y) AS sumXY, SUM(q.y * q.y) AS sumYY, MIN(q.x) AS minX, MAX(q.x) AS maxX
    FROM (${inner}) q`);
  const [r] = rows as unknown as Record<keyof RegressionSums, number | string | null>[];
  const num = (v: number | string | null) => Number(v ?? 0);
  return {
    n: num(r.n),
    sumX: num(r.sumX),
    sumY: num(r.sumY),
    sumXX: num(r.sumXX),
    sumXY: num(r.sumXY),
    sumYY: num(r.sumYY),
    minX: num(r.minX),
    maxX: num(r.maxX),
  };
}

/**
 * At most about `limit` of a comparison's points for the chart, spread over the whole set:
 * the points of every step-th journal by id, step = ⌈n / limit⌉ (a whole journal's tastings
 * together, and the journals picked before any tasting is read).
 */
export async function compareSample(
  db: Database,
  x: CompareParameterKey,
  y: CompareOutcomeKey,
  per: 'tasting' | 'journal',
  filter: CompareFilter,
  n: number,
  limit: number,
  { ordered = true }: { ordered?: boolean } = {},
): Promise<CompareRow[]> {
  const step = Math.max(1, Math.ceil(n / limit));
  const inner = pointsQuery(x, y, per, filter, { names: true });
  // Unordered, the server stops after `limit` rows instead of sorting every point first.
  const [rows] = await db.execute(sql`
    SELECT * FROM (${inner}) q
    WHERE MOD(q.journalId, ${step}) = 0
    ${ordered ? sql`ORDER BY q.journalId, q.tastingId` : sql``} LIMIT ${limit}`);
  const result = (rows as unknown as CompareRow[]).map(toRow(x));
  if (!ordered) {
    result.sort((a, b) => a.journalId - b.journalId || (a.tastingId ?? 0) - (b.tastingId ?? 0));
  }
  return result;
}

/**
 * The same sums as compareSums for overall liking per tasting against a make parameter, from
 * the per-journal figures the tastings service keeps (count, mean and Σ overall² of the
 * visible tastings): one pass over journals instead of over every tasting.
 */
export async function compareOverallSumsFromJournals(
  db: Database,
  x: CompareParameterKey,
  filter: CompareFilter,
): Promise<RegressionSums> {
  const xExpr = JOURNAL_X[x]!;
  const where = conditions(filter);
  const [rows] = await db.execute(sql`
    SELECT SUM(j.tasting_count) AS n,
           SUM(${xExpr} * j.tasting_count) AS sumX,
           SUM(j.mean_overall * j.tasting_count) AS sumY,
           SUM(${xExpr} * ${xExpr} * j.tasting_count) AS sumXX,
           SUM(${xExpr} * j.mean_overall * j.tasting_count) AS sumXY,
           SUM(j.overall_sum_squares) AS sumYY,
           MIN(${xExpr}) AS minX, MAX(${xExpr}) AS maxX
    FROM journals j ${x === 'style' ? sql`JOIN styles s ON s.id = j.style_id` : sql``}
    WHERE j.tasting_count > 0 AND ${xExpr} IS NOT NULL AND ${where}`);
  const [r] = rows as unknown as Record<keyof RegressionSums, number | string | null>[];
  const num = (v: number | string | null) => Number(v ?? 0);
  return {
    n: num(r.n),
    sumX: num(r.sumX),
    sumY: num(r.sumY),
    sumXX: num(r.sumXX),
    sumXY: num(r.sumXY),
    sumYY: num(r.sumYY),
    minX: num(r.minX),
    maxX: num(r.maxX),
  };
}

/** Whether compareOverallSumsFromJournals answers this comparison. */
export const overallSumsApply = (
  x: CompareParameterKey,
  y: CompareOutcomeKey,
  per: 'tasting' | 'journal',
) =>
  y === 'overall' &&
  per === 'tasting' &&
  x !== 'ageDays' &&
  !CATEGORY_KEYS.has(x) &&
  !!JOURNAL_X[x];

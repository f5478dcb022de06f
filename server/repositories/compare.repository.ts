import { sql, type SQL } from 'drizzle-orm';
import type { CompareOutcomeKey, CompareParameterKey } from '../../shared/constants/compare';
import type { Database } from '../db/client';

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
  const where = conditions(filter);
  const tastingY = TASTING_Y[y];
  let query: SQL;
  if (tastingY) {
    const xExpr = x === 'ageDays' ? sql`t.age_days` : JOURNAL_X[x]!;
    query =
      per === 'tasting'
        ? sql`SELECT ${xExpr} AS x, ${tastingY} AS y, j.id AS journalId, j.title AS title, u.handle AS maker, t.id AS tastingId
              FROM tastings t JOIN journals j ON j.id = t.journal_id JOIN users u ON u.id = j.user_id JOIN styles s ON s.id = j.style_id
              WHERE t.hidden_at IS NULL AND ${xExpr} IS NOT NULL AND ${where}
              ORDER BY j.id, t.id LIMIT 200000`
        : sql`SELECT ${x === 'ageDays' ? sql`AVG(t.age_days)` : sql`MIN(${xExpr})`} AS x, AVG(${tastingY}) AS y, j.id AS journalId, MIN(j.title) AS title, MIN(u.handle) AS maker, NULL AS tastingId
              FROM tastings t JOIN journals j ON j.id = t.journal_id JOIN users u ON u.id = j.user_id JOIN styles s ON s.id = j.style_id
              WHERE t.hidden_at IS NULL AND ${xExpr} IS NOT NULL AND ${where}
              GROUP BY j.id ORDER BY j.id LIMIT 200000`;
  } else {
    const yExpr = JOURNAL_Y[y]!;
    const xExpr = x === 'ageDays' ? sql`j.last_tasted_age_days` : JOURNAL_X[x]!;
    query = sql`SELECT ${xExpr} AS x, ${yExpr} AS y, j.id AS journalId, j.title AS title, u.handle AS maker, NULL AS tastingId
                FROM journals j JOIN users u ON u.id = j.user_id JOIN styles s ON s.id = j.style_id
                WHERE ${xExpr} IS NOT NULL AND ${yExpr} IS NOT NULL AND ${where}
                ORDER BY j.id LIMIT 200000`;
  }
  const [rows] = await db.execute(query);
  return (rows as unknown as CompareRow[]).map((r) => ({
    x: CATEGORY_KEYS.has(x) ? String(r.x) : Number(r.x),
    y: Number(r.y),
    journalId: Number(r.journalId),
    title: r.title,
    maker: r.maker,
    tastingId: r.tastingId === null ? null : Number(r.tastingId),
  }));
}

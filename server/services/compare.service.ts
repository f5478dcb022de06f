import { COMPARE_PARAMETERS, MIN_MEANINGFUL_POINTS } from '../../shared/constants/compare';
import { HEAT_TREATMENT_LABELS, RIND_LABELS, SPECIES_LABELS } from '../../shared/constants/journal';
import { STYLES } from '../../shared/constants/styles';
import type { CompareQuery } from '../../shared/schemas/compare';
import { groupSummaries, linearRegression } from '../../shared/trade/stats';
import type { CompareResultDto } from '../../shared/types/compare';
import type { AppContext } from '../context';
import type { AuthMember } from '../middleware/authenticate';
import { comparePoints, type CompareFilter } from '../repositories/compare.repository';
import { findStyleIdsBySlugs } from '../repositories/journals.repository';
import { findUserByHandle } from '../repositories/users.repository';

const CATEGORY_LABELS: Record<string, Record<string, string>> = {
  style: Object.fromEntries(STYLES.map((s) => [s.slug, s.name])),
  species: SPECIES_LABELS,
  heatTreatment: HEAT_TREATMENT_LABELS,
  rindTreatment: RIND_LABELS,
};

function cautionFor(n: number, reason: string | null): string | null {
  if (reason === 'no-spread-in-x')
    return 'Every point has the same value here, so no line can be fitted.';
  if (n < MIN_MEANINGFUL_POINTS) {
    return `Only ${n} ${n === 1 ? 'point' : 'points'}: with fewer than ${MIN_MEANINGFUL_POINTS}, a fitted line would not mean anything.`;
  }
  return null;
}

/**
 * Relates a make parameter to an outcome over the public journals (and the viewer's own):
 * points, the fitted line with its slope's 95 % interval, r and n for a numeric parameter;
 * n, mean, median and quartiles per group for a category. Filtering and aggregation happen in
 * SQL; the statistics come from shared/trade.
 */
export async function compare(
  ctx: AppContext,
  viewer: AuthMember | undefined,
  q: CompareQuery,
): Promise<CompareResultDto> {
  const db = ctx.database.db;
  const filter: CompareFilter = {
    viewerId: viewer?.id,
    species: q.species,
    heat: q.heat,
    rind: q.rind,
    agingMin: q.agingMin,
    agingMax: q.agingMax,
  };
  if (q.style?.length) filter.styleIds = await findStyleIdsBySlugs(db, q.style);
  if (q.maker) {
    const maker = await findUserByHandle(db, q.maker);
    filter.makerId = maker?.id ?? -1;
  }
  const parameter = COMPARE_PARAMETERS.find((p) => p.key === q.x)!;
  const outcomeIsJournalLevel = q.y === 'yieldPercent' || q.y === 'moistureLossPercent';
  const per = outcomeIsJournalLevel ? 'journal' : q.per;
  const rows = await comparePoints(db, q.x, q.y, per, filter);
  const base = { x: q.x, y: q.y, per, n: rows.length } as const;

  if (parameter.kind === 'category') {
    const labels = CATEGORY_LABELS[q.x] ?? {};
    const groups = rows.length
      ? groupSummaries(
          rows.map((r) => String(r.x)),
          rows.map((r) => r.y),
        )
      : [];
    return {
      ...base,
      kind: 'categorical',
      meaningful: rows.length >= MIN_MEANINGFUL_POINTS,
      caution: cautionFor(rows.length, null),
      points: [],
      fit: null,
      groups: groups
        .map((g) => ({
          group: g.group,
          label: labels[g.group] ?? g.group,
          n: g.n,
          mean: g.mean,
          median: g.median,
          q1: g.q1,
          q3: g.q3,
          min: g.min,
          max: g.max,
        }))
        .sort((a, b) => b.n - a.n),
    };
  }

  const points = rows.map((r) => ({ ...r, x: Number(r.x) }));
  const regression = linearRegression(
    points.map((p) => p.x),
    points.map((p) => p.y),
  );
  const fit = regression.fit;
  return {
    ...base,
    kind: 'numeric',
    meaningful: regression.meaningful,
    caution: cautionFor(regression.n, regression.reason),
    points,
    fit: fit
      ? {
          slope: fit.slope,
          intercept: fit.intercept,
          r: fit.r,
          rSquared: fit.rSquared,
          slopeStandardError: fit.slopeStandardError,
          slopeInterval95: fit.slopeConfidenceInterval95,
        }
      : null,
    groups: [],
  };
}

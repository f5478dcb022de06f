import { COMPARE_PARAMETERS, MIN_MEANINGFUL_POINTS } from '../../shared/constants/compare';
import { HEAT_TREATMENT_LABELS, RIND_LABELS, SPECIES_LABELS } from '../../shared/constants/journal';
import { STYLES } from '../../shared/constants/styles';
import type { CompareQuery } from '../../shared/schemas/compare';
import {
  groupSummaries,
  linearRegression,
  linearRegressionFromSums,
} from '../../shared/trade/stats';
import type { CompareResultDto, SideBySideDto, SideBySideRowDto } from '../../shared/types/compare';
import type { AppContext } from '../context';
import type { AuthMember } from '../middleware/authenticate';
import {
  comparePoints,
  compareSample,
  compareSums,
  type CompareFilter,
} from '../repositories/compare.repository';
import { findJournalById, findStyleIdsBySlugs } from '../repositories/journals.repository';
import { listTastingsForJournal } from '../repositories/tastings.repository';
import { getJournal } from './journals.service';
import { AGE_BANDS, meansByAgeBand } from './tastings.service';
import { findUserByHandle } from '../repositories/users.repository';

const CATEGORY_LABELS: Record<string, Record<string, string>> = {
  style: Object.fromEntries(STYLES.map((s) => [s.slug, s.name])),
  species: SPECIES_LABELS,
  heatTreatment: HEAT_TREATMENT_LABELS,
  rindTreatment: RIND_LABELS,
};

// What one point is, in the maker's words: a batch (one journal, the mean of its tastings or
// a batch-level result) or one tasting.
function cautionFor(n: number, reason: string | null, per: 'tasting' | 'journal'): string | null {
  const [one, many] = per === 'journal' ? ['batch', 'batches'] : ['tasting', 'tastings'];
  if (reason === 'no-spread-in-x')
    return `Every ${one} has the same value here, so no line can be fitted.`;
  if (n < MIN_MEANINGFUL_POINTS) {
    return `Only ${n} ${n === 1 ? one : many}: with fewer than ${MIN_MEANINGFUL_POINTS}, a fitted line would not mean anything.`;
  }
  return null;
}

/**
 * Relates a make parameter to an outcome over the public journals (and the viewer's own):
 * points, the fitted line with its slope's 95 % interval, r and n for a numeric parameter;
 * n, mean, median and quartiles per group for a category. Filtering and aggregation happen in
 * SQL over compare_facts (one narrow row per journal with its tastings' sums); the statistics
 * come from shared/trade.
 */
export async function compare(
  ctx: AppContext,
  viewer: AuthMember | undefined,
  q: CompareQuery,
): Promise<CompareResultDto> {
  return computeCompare(ctx, viewer, q);
}

/** At most this many points go to the chart; the fit always uses every point. */
export const MAX_CHART_POINTS = 2000;

async function computeCompare(
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
  if (parameter.kind === 'category') {
    const rows = await comparePoints(db, q.x, q.y, per, filter, { names: false });
    const base = { x: q.x, y: q.y, per, n: rows.length } as const;
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
      caution: cautionFor(rows.length, null, per),
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

  // The sums over every point come from the per-journal facts. When the points are few
  // enough for the chart, the fit comes from the points themselves; otherwise from the sums,
  // with a spread-out sample of points for the chart (a few hundred thousand points would be
  // megabytes of JSON).
  const sums = await compareSums(db, q.x, q.y, per, filter);
  let points;
  let regression;
  if (sums.n <= MAX_CHART_POINTS) {
    points = (await comparePoints(db, q.x, q.y, per, filter, { limit: MAX_CHART_POINTS })).map(
      (r) => ({ ...r, x: Number(r.x) }),
    );
    regression = linearRegression(
      points.map((p) => p.x),
      points.map((p) => p.y),
    );
  } else {
    regression = linearRegressionFromSums(sums);
    points = (await compareSample(db, q.x, q.y, per, filter, sums, MAX_CHART_POINTS)).map((r) => ({
      ...r,
      x: Number(r.x),
    }));
  }
  const base = { x: q.x, y: q.y, per, n: regression.n } as const;
  const fit = regression.fit;
  return {
    ...base,
    kind: 'numeric',
    meaningful: regression.meaningful,
    caution: cautionFor(regression.n, regression.reason, per),
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

type Row = SideBySideRowDto;

const sameValues = (values: (number | string | null)[]) => {
  const present = values.map((v) => (typeof v === 'number' ? Math.round(v * 1000) / 1000 : v));
  return present.every((v) => v === present[0]);
};

/**
 * Two to four journals side by side: every parameter and derived figure (SI values; the
 * client converts), with the rows that differ marked, and the mean overall liking of each at
 * matched age bands. Each journal must be readable by the viewer (404 otherwise).
 */
export async function compareJournals(
  ctx: AppContext,
  viewer: AuthMember | undefined,
  ids: number[],
): Promise<SideBySideDto> {
  const dtos = await Promise.all(ids.map((id) => getJournal(ctx, viewer, id)));
  const rows = await Promise.all(ids.map((id) => findJournalById(ctx.database.db, id)));
  const bands = await Promise.all(
    ids.map(async (id) =>
      meansByAgeBand(
        (await listTastingsForJournal(ctx.database.db, id))
          .filter((r) => r.tasting.hiddenAt === null)
          .map((r) => r.tasting),
      ),
    ),
  );
  const line = (
    key: string,
    label: string,
    unit: string | null,
    kind: string,
    pick: (i: number) => number | string | null,
  ): Row => {
    const values = ids.map((_, i) => pick(i));
    return { key, label, unit, kind, values, differs: !sameValues(values) };
  };
  const j = (i: number) => dtos[i];
  const m = (i: number) => rows[i]!;
  const table: Row[] = [
    line('style', 'Style', null, 'text', (i) => j(i).style.name),
    line('makeDate', 'Make date', null, 'date', (i) => j(i).makeDate),
    line('milkVolume', 'Milk', 'L', 'volume', (i) => j(i).milk.volumeL),
    line('species', 'Milk from', null, 'text', (i) => SPECIES_LABELS[j(i).milk.species]),
    line(
      'heatTreatment',
      'Heat treatment',
      null,
      'text',
      (i) => HEAT_TREATMENT_LABELS[j(i).milk.heatTreatment],
    ),
    line('fat', 'Fat', '%', 'plain', (i) => j(i).milk.fatPercent),
    line('protein', 'Protein', '%', 'plain', (i) => j(i).milk.proteinPercent),
    line('saltPerLitre', 'Salt per litre of milk', 'g/L', 'plain', (i) => m(i).metricSaltGPerL),
    line(
      'saltPercent',
      'Salt as % of the green cheese',
      '%',
      'plain',
      (i) => m(i).metricSaltPercent,
    ),
    line(
      'colourPerLitre',
      'Colouring per litre of milk',
      'mL/L',
      'plain',
      (i) => m(i).metricColourMlPerL,
    ),
    line(
      'calciumChloridePerLitre',
      'Calcium chloride per litre',
      'mL/L',
      'plain',
      (i) => m(i).metricCalciumChlorideMlPerL,
    ),
    line(
      'culturePerLitre',
      'Culture per litre of milk',
      'g/L',
      'plain',
      (i) => m(i).metricCultureGPerL,
    ),
    line(
      'coagulationTemp',
      'Coagulation temperature',
      '°C',
      'temperature',
      (i) => m(i).metricCoagulationTempC,
    ),
    line('cookTemp', 'Cooking temperature', '°C', 'temperature', (i) => m(i).metricCookTempC),
    line(
      'cookRamp',
      'Fastest heating ramp',
      '°C per 5 min',
      'temperature-rate',
      (i) => m(i).metricCookRampCPer5Min,
    ),
    line(
      'pressMaxKpa',
      'Highest pressure on the curd',
      'kPa',
      'pressure',
      (i) => m(i).metricPressMaxKpa,
    ),
    line('rindTreatment', 'Rind', null, 'text', (i) => RIND_LABELS[j(i).rindTreatment]),
    line('dryingDays', 'Drying days', 'days', 'plain', (i) => j(i).dryingDays),
    line('agingTarget', 'Aging target', 'days', 'plain', (i) => j(i).aging.targetDays),
    line('caveTemp', 'Cave temperature', '°C', 'temperature', (i) => j(i).aging.tempC),
    line('caveHumidity', 'Cave humidity', '%', 'plain', (i) => j(i).aging.humidityPercent),
    line(
      'yieldPercent',
      'Yield',
      '% of milk weight',
      'plain',
      (i) => j(i).derived.yield.actualPercent,
    ),
    line(
      'predictedYield',
      'Predicted yield (Van Slyke)',
      'kg per 100 kg milk',
      'plain',
      (i) => j(i).derived.yield.predictedKgPer100Kg,
    ),
    line(
      'moistureLoss',
      'Weight lost since the press',
      '%',
      'plain',
      (i) => j(i).derived.moisture.lossSinceGreenPercent,
    ),
    line('tastings', 'Tastings', null, 'plain', (i) => j(i).tastingCount),
    line('meanOverall', 'Mean overall liking', '1–9', 'plain', (i) => j(i).meanOverall),
  ];
  const bandLabels = AGE_BANDS.map((b) => b.label).filter((label) =>
    bands.some((list) => list.some((b) => b.label === label)),
  );
  return {
    journals: dtos.map((d) => ({
      id: d.id,
      title: d.title,
      maker: d.maker.handle,
      style: d.style.name,
      makeDate: d.makeDate,
    })),
    rows: table,
    scoresByAge: bandLabels.map((band) => ({
      band,
      values: bands.map((list) => list.find((b) => b.label === band)?.means.overall ?? null),
    })),
  };
}

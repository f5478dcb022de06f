import { inArray } from 'drizzle-orm';
import { expect } from 'vitest';
import type { AppContext } from '../../server/context';
import { compareFacts, journals, tastings } from '../../server/db/schema';

const OUTCOMES = ['overall', 'appearance', 'aroma', 'flavour', 'texture', 'finish'] as const;

type FactsRow = typeof compareFacts.$inferSelect;

/**
 * Compare's facts worked out from scratch in JavaScript, from the journal rows and their
 * visible tastings, for the given journals (every journal when ids is undefined).
 */
export async function factsFromScratch(
  ctx: AppContext,
  ids?: number[],
): Promise<Map<number, FactsRow>> {
  const db = ctx.database.db;
  const journalRows = ids
    ? await db.select().from(journals).where(inArray(journals.id, ids))
    : await db.select().from(journals);
  const tastingRows = ids
    ? await db.select().from(tastings).where(inArray(tastings.journalId, ids))
    : await db.select().from(tastings);
  const facts = new Map<number, FactsRow>();
  for (const j of journalRows) {
    const visible = tastingRows.filter((t) => t.journalId === j.id && t.hiddenAt === null);
    const ages = visible.map((t) => t.ageDays);
    const sum = (f: (t: (typeof visible)[number]) => number) =>
      visible.reduce((a, t) => a + f(t), 0);
    const row = {
      journalId: j.id,
      userId: j.userId,
      listed: j.status === 'published' && j.visibility === 'public' && j.hiddenAt === null,
      styleId: j.styleId,
      species: j.species,
      heatTreatment: j.heatTreatment,
      rindTreatment: j.rindTreatment,
      title: j.title,
      agingTargetDays: j.agingTargetDays,
      dryingDays: j.dryingDays,
      metricSaltGPerL: j.metricSaltGPerL,
      metricSaltPercent: j.metricSaltPercent,
      metricColourMlPerL: j.metricColourMlPerL,
      metricCalciumChlorideMlPerL: j.metricCalciumChlorideMlPerL,
      metricCultureGPerL: j.metricCultureGPerL,
      metricCoagulationTempC: j.metricCoagulationTempC,
      metricCookTempC: j.metricCookTempC,
      metricCookRampCPer5Min: j.metricCookRampCPer5Min,
      metricPressMaxKpa: j.metricPressMaxKpa,
      metricYieldPercent: j.metricYieldPercent,
      metricMoistureLossPercent: j.metricMoistureLossPercent,
      tastingCount: visible.length,
      firstTastedAgeDays: ages.length ? Math.min(...ages) : null,
      lastTastedAgeDays: ages.length ? Math.max(...ages) : null,
      ageSum: sum((t) => t.ageDays),
      ageSumSquares: sum((t) => t.ageDays * t.ageDays),
    } as Record<string, unknown>;
    for (const o of OUTCOMES) {
      row[`${o}Sum`] = sum((t) => t[o]);
      row[`${o}SumSquares`] = sum((t) => t[o] * t[o]);
      row[`${o}AgeSum`] = sum((t) => t.ageDays * t[o]);
    }
    facts.set(j.id, row as FactsRow);
  }
  return facts;
}

/** The stored compare_facts rows of the given journals (every row when ids is undefined). */
export async function storedFacts(ctx: AppContext, ids?: number[]): Promise<Map<number, FactsRow>> {
  const db = ctx.database.db;
  const rows = ids
    ? await db.select().from(compareFacts).where(inArray(compareFacts.journalId, ids))
    : await db.select().from(compareFacts);
  return new Map(rows.map((r) => [r.journalId, { ...r, listed: Boolean(r.listed) }]));
}

/**
 * Expects the stored facts of these journals (every journal when ids is undefined) to be
 * exactly the from-scratch ones: one row per existing journal, none for a deleted one.
 */
export async function expectFactsUpToDate(ctx: AppContext, ids?: number[]): Promise<number> {
  const expected = await factsFromScratch(ctx, ids);
  const stored = await storedFacts(ctx, ids);
  expect([...stored.keys()].sort((a, b) => a - b)).toEqual(
    [...expected.keys()].sort((a, b) => a - b),
  );
  for (const [id, row] of expected) {
    const got = stored.get(id)!;
    for (const [key, value] of Object.entries(row)) {
      const actual = (got as Record<string, unknown>)[key];
      if (typeof value === 'number' && typeof actual === 'number' && !Number.isInteger(value))
        expect(actual, `journal ${id} ${key}`).toBeCloseTo(value, 9);
      else expect(actual, `journal ${id} ${key}`).toEqual(value);
    }
  }
  return expected.size;
}

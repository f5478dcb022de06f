import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tastings } from '../../server/db/schema';
import { refreshJournalTastingStats } from '../../server/repositories/tastings.repository';
import { MAX_CHART_POINTS } from '../../server/services/compare.service';
import { linearRegression } from '../../shared/trade/stats';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { createMember } from '../support/factories';
import { insertJournalRow } from '../support/journal-rows';

// Past MAX_CHART_POINTS points, Compare fits from sums added up in SQL (overall liking from
// the per-journal figures) and sends a sample: the fit must be the one over every point.
let t: TestApp;
let handle = '';
const points: { x: number; overall: number; flavour: number; journalId: number }[] = [];

beforeAll(async () => {
  t = await createTestApp();
  const maker = await createMember(t.ctx);
  handle = maker.handle;
  const journalIds: number[] = [];
  for (let i = 0; i < 30; i++) {
    const salt = 1.5 + (i % 10) * 0.2;
    journalIds.push(await insertJournalRow(t.ctx, maker.id, { metricSaltGPerL: salt }));
  }
  const rows = [];
  for (let k = 0; k < MAX_CHART_POINTS + 300; k++) {
    const journal = k % journalIds.length;
    const x = 1.5 + (journal % 10) * 0.2;
    const overall = 1 + ((k * 7 + journal * 3) % 9);
    const flavour = 1 + ((k * 5 + journal) % 9);
    const hidden = k % 97 === 0;
    if (!hidden) points.push({ x, overall, flavour, journalId: journalIds[journal] });
    rows.push({
      journalId: journalIds[journal],
      tasterId: maker.id,
      tastedOn: '2026-03-01',
      ageDays: 40 + (k % 50),
      overall,
      appearance: 5,
      aroma: 5,
      flavour,
      texture: 5,
      finish: 5,
      descriptors: [],
      defects: [],
      notes: '',
      hiddenAt: hidden ? new Date() : null,
    });
  }
  for (let i = 0; i < rows.length; i += 500)
    await t.ctx.database.db.insert(tastings).values(rows.slice(i, i + 500));
  for (const id of journalIds) await refreshJournalTastingStats(t.ctx.database.db, id);
}, 60_000);

afterAll(() => t.close());

function expectSameFit(body: { n: number; fit: Record<string, number> }, ys: number[]) {
  const exact = linearRegression(
    points.map((p) => p.x),
    ys,
  ).fit!;
  expect(body.n).toBe(points.length);
  for (const key of ['slope', 'intercept', 'r', 'slopeStandardError'] as const) {
    expect(body.fit[key]).toBeCloseTo(exact[key] as number, 9);
  }
}

describe('Compare past the chart limit', () => {
  it('fits overall liking over every visible tasting from the per-journal sums', async () => {
    const res = await visitor(t.app)
      .get(`/api/compare?x=saltPerLitre&y=overall&per=tasting&maker=${handle}`)
      .expect(200);
    expectSameFit(
      res.body,
      points.map((p) => p.overall),
    );
    expect(res.body.points.length).toBeGreaterThan(MAX_CHART_POINTS / 2);
    expect(res.body.points.length).toBeLessThanOrEqual(MAX_CHART_POINTS);
  });

  it('fits any other score from sums over the tastings', async () => {
    const res = await visitor(t.app)
      .get(`/api/compare?x=saltPerLitre&y=flavour&per=tasting&maker=${handle}`)
      .expect(200);
    expectSameFit(
      res.body,
      points.map((p) => p.flavour),
    );
    expect(res.body.points.length).toBeLessThanOrEqual(MAX_CHART_POINTS);
  });
});

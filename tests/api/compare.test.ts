import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { COMPARE_PARAMETER_KEYS } from '../../shared/constants/compare';
import { tastings } from '../../server/db/schema/tastings';
import { refreshJournalTastingStats } from '../../server/repositories/tastings.repository';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { createMember, signedIn } from '../support/factories';
import { postJournal, publicJournalDocument } from '../support/journal-factory';
import { daysAgo, insertJournalRow } from '../support/journal-rows';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

async function addTasting(journalId: number, tasterId: number, overall: number, ageDays = 90) {
  await t.ctx.database.db.insert(tastings).values({
    journalId,
    tasterId,
    tastedOn: daysAgo(0),
    ageDays,
    overall,
    appearance: overall,
    aroma: overall,
    flavour: overall,
    texture: overall,
    finish: overall,
    descriptors: [],
    defects: [],
    notes: '',
  });
  // As the tastings service does after every tasting it writes.
  await refreshJournalTastingStats(t.ctx.database.db, journalId);
}

// Anscombe's quartet: F. J. Anscombe, "Graphs in Statistical Analysis", The American
// Statistician 27(1), 17-21, 1973. Each set fits y = 3.00 + 0.500 x with r = 0.816.
function anscombe(): number[][][] {
  const url = new URL('../fixtures/anscombe.csv', import.meta.url);
  const lines = readFileSync(url, 'utf8')
    .trim()
    .split('\n')
    .filter((l) => !l.startsWith('#'));
  const rows = lines.slice(1).map((l) => l.split(',').map(Number));
  return [0, 1, 2, 3].map((set) => rows.map((r) => [r[set * 2], r[set * 2 + 1]]));
}

describe('GET /api/compare', () => {
  it('refuses unknown keys with the list of valid ones', async () => {
    const res = await visitor(t.app).get('/api/compare?x=moonPhase&y=overall');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.x).toContain('saltPerLitre');
    for (const key of COMPARE_PARAMETER_KEYS) expect(res.body.error.fields.x).toContain(key);
    const y = await visitor(t.app).get('/api/compare?x=saltPerLitre&y=happiness');
    expect(y.status).toBe(400);
    expect(y.body.error.fields.y).toContain('overall');
    expect(
      (await visitor(t.app).get('/api/compare?x=saltPerLitre&y=overall&per=batch')).status,
    ).toBe(400);
  });

  it('recovers a planted relation between salt per litre and overall liking within its interval', async () => {
    const maker = await createMember(t.ctx);
    // overall = 2 + 1.5 × salt g/L, rounded to the 1-9 scale: a planted slope of 1.5.
    const salts = [1.2, 1.5, 1.8, 2.1, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9];
    for (const [i, salt] of salts.entries()) {
      const id = await insertJournalRow(t.ctx, maker.id, {
        title: `Salt ${salt}`,
        metricSaltGPerL: salt,
      });
      await addTasting(id, maker.id, Math.round(2 + 1.5 * salt + (i % 2 ? 0.4 : -0.4)));
    }
    const res = await visitor(t.app)
      .get(`/api/compare?x=saltPerLitre&y=overall&style=cheddar&maker=${maker.handle}`)
      .expect(200);
    expect(res.body).toMatchObject({
      kind: 'numeric',
      n: 10,
      meaningful: true,
      caution: null,
      per: 'journal',
    });
    const [lo, hi] = res.body.fit.slopeInterval95;
    expect(lo).toBeLessThan(1.5);
    expect(hi).toBeGreaterThan(1.5);
    expect(res.body.fit.r).toBeGreaterThan(0.9);
    expect(res.body.points[0]).toMatchObject({
      journalId: expect.any(Number),
      title: expect.stringMatching(/^Salt /),
      maker: maker.handle,
    });
  });

  it("follows Anscombe's quartet through the whole path: intercept 3.00, slope 0.500, r 0.816 for each set", async () => {
    for (const set of anscombe()) {
      const maker = await createMember(t.ctx);
      // x as salt per litre, y as the journal's yield %: a journal-level outcome, one point per journal.
      for (const [x, y] of set)
        await insertJournalRow(t.ctx, maker.id, { metricSaltGPerL: x, metricYieldPercent: y });
      const res = await visitor(t.app)
        .get(`/api/compare?x=saltPerLitre&y=yieldPercent&maker=${maker.handle}`)
        .expect(200);
      expect(res.body.per).toBe('journal');
      expect(res.body.n).toBe(11);
      expect(res.body.fit.intercept).toBeCloseTo(3.0, 2);
      expect(res.body.fit.slope).toBeCloseTo(0.5, 3);
      expect(res.body.fit.r).toBeCloseTo(0.816, 2);
    }
  });

  it('says the fit is not meaningful below five points', async () => {
    const maker = await createMember(t.ctx);
    for (const salt of [1, 2, 3]) {
      const id = await insertJournalRow(t.ctx, maker.id, { metricSaltGPerL: salt });
      await addTasting(id, maker.id, 5 + salt);
    }
    const res = await visitor(t.app)
      .get(`/api/compare?x=saltPerLitre&y=overall&maker=${maker.handle}`)
      .expect(200);
    expect(res.body.n).toBe(3);
    expect(res.body.meaningful).toBe(false);
    expect(res.body.caution).toMatch(/^Only 3 batches: with fewer than 5/);
  });

  it('summarises categories: n, mean, median and quartiles per rind treatment', async () => {
    const maker = await createMember(t.ctx);
    const plan: Array<['waxed' | 'natural', number]> = [
      ['waxed', 5],
      ['waxed', 6],
      ['waxed', 7],
      ['natural', 8],
      ['natural', 8],
    ];
    for (const [rind, score] of plan) {
      const id = await insertJournalRow(t.ctx, maker.id, { rindTreatment: rind });
      await addTasting(id, maker.id, score);
    }
    const res = await visitor(t.app)
      .get(`/api/compare?x=rindTreatment&y=overall&maker=${maker.handle}`)
      .expect(200);
    expect(res.body.kind).toBe('categorical');
    expect(res.body.groups).toEqual([
      expect.objectContaining({
        group: 'waxed',
        label: 'Waxed',
        n: 3,
        mean: 6,
        median: 6,
        q1: 5.5,
        q3: 6.5,
      }),
      expect.objectContaining({
        group: 'natural',
        label: 'Natural rind',
        n: 2,
        mean: 8,
        median: 8,
      }),
    ]);
  });

  it("never counts private journals or drafts for others, but counts the viewer's own", async () => {
    const owner = await signedIn(t.app, t.ctx);
    const open = await insertJournalRow(t.ctx, owner.member.id, { metricSaltGPerL: 2 });
    await addTasting(open, owner.member.id, 6);
    const hidden = await insertJournalRow(t.ctx, owner.member.id, {
      metricSaltGPerL: 3,
      visibility: 'private',
    });
    await addTasting(hidden, owner.member.id, 7);
    const draft = await insertJournalRow(t.ctx, owner.member.id, {
      metricSaltGPerL: 4,
      status: 'draft',
    });
    await addTasting(draft, owner.member.id, 8);
    const url = `/api/compare?x=saltPerLitre&y=overall&maker=${owner.member.handle}`;
    const stranger = await visitor(t.app).get(url).expect(200);
    expect(stranger.body.points.map((p: { journalId: number }) => p.journalId)).toEqual([open]);
    const other = await (await signedIn(t.app, t.ctx)).get(url).expect(200);
    expect(other.body.n).toBe(1);
    const mine = await owner.get(url).expect(200);
    expect(mine.body.points.map((p: { journalId: number }) => p.journalId).sort()).toEqual(
      [open, hidden, draft].sort(),
    );
  });

  it('counts one point per batch by default, and every scorecard only with per=tasting', async () => {
    const maker = await createMember(t.ctx);
    // Five wheels, the first tasted four times: those tastings are not five more batches.
    for (const [i, salt] of [1.5, 2, 2.5, 3, 3.5].entries()) {
      const id = await insertJournalRow(t.ctx, maker.id, { metricSaltGPerL: salt });
      for (const score of i === 0 ? [4, 4, 5, 4] : [5 + (i % 2)])
        await addTasting(id, maker.id, score);
    }
    const base = `/api/compare?x=saltPerLitre&y=overall&maker=${maker.handle}`;
    const byBatch = await visitor(t.app).get(base).expect(200);
    expect(byBatch.body).toMatchObject({ per: 'journal', n: 5, meaningful: true });
    expect(byBatch.body.points.every((p: { tastingId: unknown }) => p.tastingId === null)).toBe(
      true,
    );
    expect(byBatch.body.points.find((p: { x: number }) => p.x === 1.5).y).toBeCloseTo(4.25, 9);
    const byTasting = await visitor(t.app).get(`${base}&per=tasting`).expect(200);
    expect(byTasting.body).toMatchObject({ per: 'tasting', n: 8 });
    // Counting the repeat tastings as points narrows the slope's interval: the reason the
    // default is one point per batch.
    const width = (b: { fit: { slopeInterval95: [number, number] } }) =>
      b.fit.slopeInterval95[1] - b.fit.slopeInterval95[0];
    expect(width(byTasting.body)).toBeLessThan(width(byBatch.body));
  });

  it('averages per journal with per=journal, age at tasting included', async () => {
    const maker = await createMember(t.ctx);
    const id = await insertJournalRow(t.ctx, maker.id, { metricSaltGPerL: 2 });
    await addTasting(id, maker.id, 6, 60);
    await addTasting(id, maker.id, 8, 120);
    const res = await visitor(t.app)
      .get(`/api/compare?x=ageDays&y=overall&per=journal&maker=${maker.handle}`)
      .expect(200);
    expect(res.body.points).toEqual([
      expect.objectContaining({ journalId: id, x: 90, y: 7, tastingId: null }),
    ]);
  });
});

describe('GET /api/compare/journals', () => {
  it('refuses fewer than two, more than four, repeated or malformed ids', async () => {
    for (const ids of ['1', '1,2,3,4,5', '3,3', 'a,b', '']) {
      const res = await visitor(t.app).get(`/api/compare/journals?ids=${ids}`);
      expect(res.status, ids).toBe(400);
      expect(
        Object.keys(res.body.error.fields).some((k) => k.startsWith('ids')),
        ids,
      ).toBe(true);
    }
  });

  it('puts two journals side by side, marks what differs, and hides private journals (404)', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const a = await postJournal(maker, { ...publicJournalDocument(), title: 'Side A' });
    const b = await postJournal(maker, {
      ...publicJournalDocument(),
      title: 'Side B',
      rindTreatment: 'cloth-bound',
    });
    await addTasting(a.id, maker.member.id, 6, 70);
    await addTasting(b.id, maker.member.id, 8, 75);
    const res = await visitor(t.app).get(`/api/compare/journals?ids=${a.id},${b.id}`).expect(200);
    expect(res.body.journals.map((j: { title: string }) => j.title)).toEqual(['Side A', 'Side B']);
    const row = (key: string) => res.body.rows.find((r: { key: string }) => r.key === key);
    expect(row('rindTreatment')).toMatchObject({ values: ['Waxed', 'Cloth-bound'], differs: true });
    expect(row('style')).toMatchObject({ differs: false });
    expect(row('pressMaxKpa').values[0]).toBeGreaterThan(0);
    expect(res.body.scoresByAge).toEqual([{ band: '2 to 3 months', values: [6, 8] }]);

    const secret = await postJournal(maker, { title: 'Secret' });
    expect(
      (await visitor(t.app).get(`/api/compare/journals?ids=${a.id},${secret.id}`)).status,
    ).toBe(404);
    expect((await maker.get(`/api/compare/journals?ids=${a.id},${secret.id}`)).status).toBe(200);
  });
});

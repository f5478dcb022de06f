import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { journals } from '../../server/db/schema';
import { toKilograms, toLitres, toNewtons } from '../../shared/trade/units';
import type { JournalDto } from '../../shared/types/journal';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { signedIn } from '../support/factories';
import {
  expectStatus,
  journalDocument,
  postJournal,
  publicJournalDocument,
  putJournal,
} from '../support/journal-factory';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

const member = (opts: Parameters<typeof signedIn>[2] = {}) => signedIn(t.app, t.ctx, opts);

describe('POST /api/journals', () => {
  it('refuses a visitor who is not signed in (401)', async () => {
    const res = await visitor(t.app).post('/api/journals', journalDocument());
    expect(res.status).toBe(401);
  });

  it('answers 400 with a message per field for invalid fields', async () => {
    const v = await member();
    const doc = journalDocument({ title: '' });
    const res = await v.post('/api/journals', {
      ...doc,
      milk: { ...doc.milk, volumeL: -2 },
      steps: [{ kind: 'cooking', targetTempC: 400 }],
      ingredients: [{ kind: 'colouring', name: 'Annatto', amount: 3, unit: 'drop' }],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('VALIDATION_FAILED');
    const fields = res.body.error.fields;
    expect(fields.title).toBeTruthy();
    expect(fields['milk.volumeL']).toMatch(/more than zero/);
    expect(fields['steps.0.targetTempC']).toMatch(/at most 110/);
    expect(fields['ingredients.0.mlPerDrop']).toMatch(/drop/);
  });

  it('answers 400 for an unknown style', async () => {
    const v = await member();
    const res = await v.post('/api/journals', {
      ...journalDocument(),
      styleSlug: 'plastic-cheese',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.styleSlug).toBeTruthy();
  });

  it('refuses to publish for a member whose e-mail is not confirmed (403)', async () => {
    const v = await member({ verified: false });
    const res = await v.post('/api/journals', publicJournalDocument());
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('EMAIL_NOT_VERIFIED');
    // ...but a draft is fine
    const draft = await v.post('/api/journals', journalDocument());
    expect(draft.status).toBe(201);
  });

  it('creates a journal and answers 201 with the whole document, SI amounts and canEdit', async () => {
    const v = await member();
    const res = await v.post('/api/journals', publicJournalDocument());
    expect(res.status).toBe(201);
    const j: JournalDto = res.body;
    expect(res.headers.location).toBe(`/api/journals/${j.id}`);
    expect(j.canEdit).toBe(true);
    expect(j.maker.handle).toBe(v.member.handle);
    expect(j.style.slug).toBe('cheddar');
    expect(j.ingredients).toHaveLength(5);
    expect(j.ingredients[4]).toMatchObject({ kind: 'salt', amount: 1, unit: 'oz' });
    expect(j.ingredients[4].si.dimension).toBe('mass');
    expect(j.ingredients[4].si.value).toBeCloseTo(toKilograms(1, 'oz'), 12);
    expect(j.ingredients[2].si).toEqual({ dimension: 'count', value: 8 });
    expect(j.steps.map((s) => s.kind)[4]).toBe('cooking');
    expect(j.pressStages).toHaveLength(3);
    expect(j.notesHtml).toContain('<strong>90 minutes</strong>');
    const [row] = await t.ctx.database.db.select().from(journals).where(eq(journals.id, j.id));
    expect(row.publishedAt).toBeInstanceOf(Date);
  });
});

describe('GET /api/journals/:id and who may see it', () => {
  let owner: Awaited<ReturnType<typeof member>>;
  let other: Awaited<ReturnType<typeof member>>;
  let publicId: number;
  let privateId: number;
  let draftId: number;
  let unlistedId: number;

  beforeAll(async () => {
    owner = await member();
    other = await member();
    publicId = (await expectStatus(owner.post('/api/journals', publicJournalDocument()), 201)).body
      .id;
    privateId = (
      await expectStatus(
        owner.post(
          '/api/journals',
          journalDocument({ status: 'published', visibility: 'private' }),
        ),
        201,
      )
    ).body.id;
    draftId = (
      await expectStatus(
        owner.post('/api/journals', journalDocument({ status: 'draft', visibility: 'public' })),
        201,
      )
    ).body.id;
    unlistedId = (
      await expectStatus(
        owner.post('/api/journals', publicJournalDocument({ visibility: 'unlisted' })),
        201,
      )
    ).body.id;
  });

  it('answers 400 for an id that is not a positive whole number', async () => {
    expect((await visitor(t.app).get('/api/journals/abc')).status).toBe(400);
    expect((await visitor(t.app).get('/api/journals/0')).status).toBe(400);
    expect((await visitor(t.app).get('/api/journals/1.5')).status).toBe(400);
  });

  it('answers 404 JOURNAL_NOT_FOUND for an unknown id', async () => {
    const res = await visitor(t.app).get('/api/journals/999999999');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('JOURNAL_NOT_FOUND');
  });

  it('hides private journals and drafts from everyone but the owner, with the same 404', async () => {
    for (const id of [privateId, draftId]) {
      const anon = await visitor(t.app).get(`/api/journals/${id}`);
      expect(anon.status).toBe(404);
      expect(anon.body.error.code).toBe('JOURNAL_NOT_FOUND');
      expect((await other.get(`/api/journals/${id}`)).status).toBe(404);
      const mine = await owner.get(`/api/journals/${id}`);
      expect(mine.status).toBe(200);
      expect(mine.body.canEdit).toBe(true);
    }
  });

  it('lets anyone read public and unlisted journals by their link, canEdit false', async () => {
    for (const id of [publicId, unlistedId]) {
      const res = await visitor(t.app).get(`/api/journals/${id}`);
      expect(res.status).toBe(200);
      expect(res.body.canEdit).toBe(false);
      expect((await other.get(`/api/journals/${id}`)).body.canEdit).toBe(false);
    }
  });

  it('hides a hidden journal from readers but not from moderators, admins or the owner', async () => {
    const id = (await expectStatus(owner.post('/api/journals', publicJournalDocument()), 201)).body
      .id;
    await t.ctx.database.db
      .update(journals)
      .set({ hiddenAt: new Date() })
      .where(eq(journals.id, id));
    expect((await visitor(t.app).get(`/api/journals/${id}`)).status).toBe(404);
    expect((await other.get(`/api/journals/${id}`)).status).toBe(404);
    expect((await owner.get(`/api/journals/${id}`)).status).toBe(200);
    const moderator = await member({ role: 'moderator' });
    expect((await moderator.get(`/api/journals/${id}`)).status).toBe(200);
    const admin = await member({ role: 'admin' });
    expect((await admin.get(`/api/journals/${id}`)).status).toBe(200);
    // staff read hidden items, not private ones
    expect((await moderator.get(`/api/journals/${privateId}`)).status).toBe(404);
  });

  it('renders Markdown notes safely: no raw HTML, no script, links nofollow noopener', async () => {
    const id = (
      await expectStatus(
        owner.post(
          '/api/journals',
          publicJournalDocument({
            notes:
              'See https://example.test/cheddar and [this](javascript:alert(1)).\n\n<script>alert(1)</script><img src=x onerror=alert(1)>',
          }),
        ),
        201,
      )
    ).body.id;
    const html: string = (await visitor(t.app).get(`/api/journals/${id}`)).body.notesHtml;
    expect(html).toContain('href="https://example.test/cheddar"');
    expect(html).toContain('rel="nofollow noopener"');
    // the HTML arrives as text, and the javascript: link is not a link
    expect(html).not.toMatch(/<script|<img|href="javascript:/i);
    expect(html).not.toMatch(/<[^>]+\son\w+=/i);
    expect(html).toContain('&lt;script&gt;');
  });
});

describe('PUT /api/journals/:id', () => {
  it('answers 404 to a non-owner for a private journal and 403 for a visible one', async () => {
    const owner = await member();
    const other = await member();
    const hidden = await postJournal(owner);
    const shown = (await expectStatus(owner.post('/api/journals', publicJournalDocument()), 201))
      .body;
    const privateEdit = await putJournal(other, hidden.id, journalDocument(), hidden.version);
    expect(privateEdit.status).toBe(404);
    expect(privateEdit.body.error.code).toBe('JOURNAL_NOT_FOUND');
    const publicEdit = await putJournal(other, shown.id, journalDocument(), shown.version);
    expect(publicEdit.status).toBe(403);
    expect((await visitor(t.app).put(`/api/journals/${shown.id}`, journalDocument())).status).toBe(
      401,
    );
  });

  it('answers 400 with per-field messages and leaves the journal as it was', async () => {
    const owner = await member();
    const j = await postJournal(owner);
    const doc = journalDocument();
    const res = await putJournal(
      owner,
      j.id,
      { ...doc, steps: [{ kind: 'cooking', targetTempC: 'hot' }] },
      j.version,
    );
    expect(res.status).toBe(400);
    expect(res.body.error.fields['steps.0.targetTempC']).toBeTruthy();
    expect((await owner.get(`/api/journals/${j.id}`)).body.steps).toHaveLength(9);
  });

  it('replaces the whole document, keeps readings, and stamps published_at on first publish', async () => {
    const owner = await member();
    const j = await postJournal(owner);
    const reading = { id: randomUUID(), takenAt: '2026-01-10T10:00:00Z', tempC: 31 };
    await expectStatus(owner.post(`/api/journals/${j.id}/readings`, reading), 201);
    const res = await putJournal(
      owner,
      j.id,
      publicJournalDocument({
        title: 'Renamed cheddar',
        ingredients: [{ kind: 'salt', name: 'Salt', amount: 30, unit: 'g' }],
        steps: [{ kind: 'cooking', targetTempC: 39 }],
        pressStages: [],
        weighIns: [{ date: '2026-02-10', massKg: 1.7 }],
      }),
      j.version,
    );
    expect(res.status).toBe(200);
    expect(res.body.title).toBe('Renamed cheddar');
    expect(res.body.ingredients).toHaveLength(1);
    expect(res.body.steps).toHaveLength(1);
    expect(res.body.pressStages).toHaveLength(0);
    expect(res.body.weighIns).toEqual([{ date: '2026-02-10', massKg: 1.7, note: '' }]);
    expect(res.body.readings.map((r: { id: string }) => r.id)).toEqual([reading.id]);
    const [row] = await t.ctx.database.db.select().from(journals).where(eq(journals.id, j.id));
    expect(row.publishedAt).toBeInstanceOf(Date);
    expect(row.metricSaltGPerL).toBeCloseTo(30 / toLitres(4, 'gal'), 9);
    expect(row.metricCookTempC).toBe(39);
    expect(row.metricPressMaxKpa).toBeNull();
    const first = row.publishedAt!.getTime();
    await expectStatus(putJournal(owner, j.id, publicJournalDocument(), res.body.version), 200);
    const [again] = await t.ctx.database.db.select().from(journals).where(eq(journals.id, j.id));
    expect(again.publishedAt!.getTime()).toBe(first);
  });

  it('refuses to publish an existing draft for an unverified member (403)', async () => {
    const owner = await member({ verified: false });
    const j = await postJournal(owner);
    const res = await putJournal(owner, j.id, publicJournalDocument(), j.version);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('EMAIL_NOT_VERIFIED');
  });
});

describe('DELETE /api/journals/:id', () => {
  it('lets only the owner, a moderator or an admin delete', async () => {
    const owner = await member();
    const other = await member();
    const a = (await expectStatus(owner.post('/api/journals', publicJournalDocument()), 201)).body;
    const b = (await expectStatus(owner.post('/api/journals', publicJournalDocument()), 201)).body;
    const priv = await postJournal(owner);
    expect((await visitor(t.app).delete(`/api/journals/${a.id}`)).status).toBe(401);
    expect((await other.delete(`/api/journals/${a.id}`)).status).toBe(403);
    expect((await other.delete(`/api/journals/${priv.id}`)).status).toBe(404);
    expect((await other.delete('/api/journals/nope')).status).toBe(400);
    expect((await owner.delete(`/api/journals/${a.id}`)).status).toBe(204);
    expect((await owner.get(`/api/journals/${a.id}`)).status).toBe(404);
    const moderator = await member({ role: 'moderator' });
    expect((await moderator.delete(`/api/journals/${b.id}`)).status).toBe(204);
    expect((await owner.delete(`/api/journals/${priv.id}`)).status).toBe(204);
  });

  it('goes with the account: journals cascade when a member deletes their account', async () => {
    const owner = await member();
    const j = (await expectStatus(owner.post('/api/journals', publicJournalDocument()), 201)).body;
    // a copy of their own journal points back at it: the self-reference must not block
    await expectStatus(
      owner.post(`/api/journals/${j.id}/copy`, { milkVolume: 10, unit: 'L' }),
      201,
    );
    const reader = await member();
    const theirs = (
      await expectStatus(
        reader.post(`/api/journals/${j.id}/copy`, { milkVolume: 5, unit: 'L' }),
        201,
      )
    ).body;
    await expectStatus(owner.delete('/api/auth/me', { password: owner.member.password }), 204);
    expect((await reader.get(`/api/journals/${j.id}`)).status).toBe(404);
    const left = await reader.get(`/api/journals/${theirs.id}`).expect(200);
    expect(left.body.source).toBeNull();
  });
});

describe('derived figures on a known journal', () => {
  it('works out pressure, yield, rates, moisture loss and aging with shared/trade', async () => {
    const owner = await member();
    const doc = journalDocument({
      makeDate: '2026-01-10',
      greenWeightKg: toKilograms(4, 'lb'),
      weighIns: [{ date: '2026-01-24', massKg: toKilograms(4, 'lb') - toKilograms(3, 'oz') }],
    });
    const j: JournalDto = (await expectStatus(owner.post('/api/journals', doc), 201)).body;
    const d = j.derived;
    const milkL = toLitres(4, 'gal');
    expect(d.milkMassKg).toBeCloseTo(milkL * 1.03, 9);
    expect(d.milkDensityAssumed).toBe(false);
    // 50 lb on an 8-inch round mould is about 1.0 psi, 6.9 kPa (common practice, no published source)
    const top = d.press[2];
    expect(top.loadN).toBeCloseTo(toNewtons(50, 'lbf'), 9);
    expect(top.kPa).toBeCloseTo(6.86, 2);
    expect(top.psi).toBeCloseTo(0.995, 2);
    expect(d.press.map((p) => [p.startMinute, p.endMinute])).toEqual([
      [0, 15],
      [15, 45],
      [45, 765],
    ]);
    // 4 lb of cheese from 4 US gallons is about 11.6 % (common practice, no published source);
    // yield is taken at the latest weigh-in, here 4 lb less 3 oz
    const greenYield = (toKilograms(4, 'lb') / (milkL * 1.03)) * 100;
    expect(greenYield).toBeCloseTo(11.63, 2);
    expect(d.yield.actualPercent).toBeCloseTo(greenYield * (61 / 64), 9);
    // Van Slyke with 3.6 % fat, casein 0.78 × 3.2 %, 37 % moisture (Van Slyke and Price 1949)
    const casein = 3.2 * 0.78;
    const predicted = ((0.93 * 3.6 + casein - 0.1) * 1.09) / (1 - 0.37);
    expect(d.yield.predictedKgPer100Kg).toBeCloseTo(predicted, 9);
    expect(d.yield.efficiency).toBeCloseTo(d.yield.actualPercent! / predicted, 9);
    expect(d.yield.basis).toMatch(/37 %/);
    expect(d.yield.basis).toMatch(/21 CFR 133\.113/);
    // a 4 lb wheel that loses 3 oz has lost about 4.7 % (common practice, no published source)
    expect(d.moisture.lossSinceGreenPercent).toBeCloseTo(4.6875, 9);
    expect(d.moisture.ratePerWeekPercent).toBeCloseTo(4.6875 / 2, 9);
    expect(d.moisture.series).toHaveLength(1);
    // rates per litre of milk: salt 1 oz by mass; calcium chloride 1 tsp; annatto 8 drops × 0.05 mL
    expect(d.rates.saltGramsPerLitre).toBeCloseTo(28.349523125 / milkL, 9);
    expect(d.rates.saltPercentOfCheese).toBeCloseTo((28.349523125 / 1814.36948) * 100, 6);
    expect(d.rates.calciumChlorideMlPerLitre).toBeCloseTo(4.92892159375 / milkL, 9);
    expect(d.rates.colouringMlPerLitre).toBeCloseTo(0.4 / milkL, 9);
    expect(d.rates.cultureGramsPerLitre).toBeCloseTo(2 / milkL, 9);
    expect(d.aging.targetDays).toBe(90);
    expect(d.aging.readyDate).toBe('2026-04-10');
    expect(d.rawMilkCaution).toBeNull();
    const [row] = await t.ctx.database.db.select().from(journals).where(eq(journals.id, j.id));
    expect(row.metricPressMaxKpa).toBeCloseTo(top.kPa, 9);
    expect(row.metricYieldPercent).toBeCloseTo(d.yield.actualPercent!, 9);
    expect(row.metricMoistureLossPercent).toBeCloseTo(4.6875, 9);
    expect(row.metricCoagulationTempC).toBe(31.5);
    expect(row.metricCookTempC).toBe(38.5);
    expect(row.metricColourMlPerL).toBeCloseTo(0.4 / milkL, 9);
  });

  it('leaves the prediction out when fat or protein is unknown, and cautions on raw milk', async () => {
    const owner = await member();
    const today = new Date().toISOString().slice(0, 10);
    const j: JournalDto = (
      await expectStatus(
        owner.post(
          '/api/journals',
          journalDocument({
            makeDate: today,
            milk: { fatPercent: null, heatTreatment: 'raw', species: 'goat' },
            ingredients: [{ kind: 'salt', name: 'Salt', amount: 1, unit: 'tbsp' }],
          }),
        ),
        201,
      )
    ).body;
    expect(j.derived.yield.predictedKgPer100Kg).toBeNull();
    expect(j.derived.yield.basis).toBeNull();
    expect(j.derived.milkDensityAssumed).toBe(true);
    // salt by volume cannot be a g/L figure without a density
    expect(j.derived.rates.saltGramsPerLitre).toBeNull();
    expect(j.derived.rawMilkCaution?.flagged).toBe(true);
    expect(j.derived.rawMilkCaution?.text).toMatch(/21 CFR 133\.113/);
  });
});

describe('POST /api/journals/:id/copy', () => {
  it('refuses visitors (401), bad bodies (400) and journals the member cannot read (404)', async () => {
    const owner = await member();
    const priv = await postJournal(owner);
    expect(
      (await visitor(t.app).post(`/api/journals/${priv.id}/copy`, { milkVolume: 2, unit: 'L' }))
        .status,
    ).toBe(401);
    const other = await member();
    const bad = await other.post(`/api/journals/${priv.id}/copy`, { milkVolume: -1, unit: 'pint' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['milkVolume', 'unit']);
    expect(
      (await other.post(`/api/journals/${priv.id}/copy`, { milkVolume: 2, unit: 'L' })).status,
    ).toBe(404);
  });

  it('makes a private draft scaled to the new milk: 2× milk is 2× every amount, units kept', async () => {
    const owner = await member();
    const source: JournalDto = (
      await expectStatus(
        owner.post(
          '/api/journals',
          publicJournalDocument({
            weighIns: [{ date: '2026-02-01', massKg: 1.7 }],
          }),
        ),
        201,
      )
    ).body;
    await expectStatus(
      owner.post(`/api/journals/${source.id}/readings`, {
        id: randomUUID(),
        takenAt: '2026-01-10T10:00:00Z',
        tempC: 31,
      }),
      201,
    );
    const reader = await member({ verified: false });
    const res = await reader.post(`/api/journals/${source.id}/copy`, {
      milkVolume: 8,
      unit: 'gal',
    });
    expect(res.status).toBe(201);
    const copy: JournalDto = res.body;
    expect(copy.id).not.toBe(source.id);
    expect(copy.maker.handle).toBe(reader.member.handle);
    expect(copy.status).toBe('draft');
    expect(copy.visibility).toBe('private');
    expect(copy.title).toBe(`${source.title} (from @${owner.member.handle})`);
    expect(copy.source).toEqual({ id: source.id, title: source.title, maker: source.maker });
    expect(copy.milk.volumeL).toBeCloseTo(toLitres(8, 'gal'), 9);
    expect(copy.milk.volumeUnit).toBe('gal');
    expect(copy.ingredients).toHaveLength(source.ingredients.length);
    copy.ingredients.forEach((ing, i) => {
      const from = source.ingredients[i];
      expect(ing.unit).toBe(from.unit);
      expect(ing.kind).toBe(from.kind);
      expect(ing.amount).toBeCloseTo(from.amount * 2, 9);
      expect(ing.si.value).toBeCloseTo(from.si.value * 2, 9);
    });
    expect(copy.steps.map((s) => s.kind)).toEqual(source.steps.map((s) => s.kind));
    // what the source maker did becomes the plan
    expect(copy.steps[4].targetTempC).toBe(38);
    expect(copy.steps[4].actualTempC).toBeNull();
    expect(copy.pressStages).toEqual(source.pressStages);
    expect(copy.weighIns).toEqual([]);
    expect(copy.readings).toEqual([]);
    expect(copy.photos).toEqual([]);
    expect(copy.greenWeightKg).toBeNull();
    expect(copy.tastingCount).toBe(0);
    // the draft is the copier's own: invisible to the source maker
    expect((await owner.get(`/api/journals/${copy.id}`)).status).toBe(404);
  });

  it('copies an unlisted journal by link, in another unit', async () => {
    const owner = await member();
    const source: JournalDto = (
      await expectStatus(
        owner.post('/api/journals', publicJournalDocument({ visibility: 'unlisted' })),
        201,
      )
    ).body;
    const reader = await member();
    const copy: JournalDto = (
      await expectStatus(
        reader.post(`/api/journals/${source.id}/copy`, {
          milkVolume: toLitres(2, 'gal'),
          unit: 'L',
        }),
        201,
      )
    ).body;
    copy.ingredients.forEach((ing, i) =>
      expect(ing.amount).toBeCloseTo(source.ingredients[i].amount / 2, 9),
    );
  });
});

describe('POST /api/journals/:id/readings', () => {
  it('is for the owner only, and checks the reading', async () => {
    const owner = await member();
    const other = await member();
    const shown = (await expectStatus(owner.post('/api/journals', publicJournalDocument()), 201))
      .body;
    const reading = { id: randomUUID(), takenAt: '2026-01-10T10:00:00Z', tempC: 31 };
    expect((await visitor(t.app).post(`/api/journals/${shown.id}/readings`, reading)).status).toBe(
      401,
    );
    expect((await other.post(`/api/journals/${shown.id}/readings`, reading)).status).toBe(403);
    const bad = await owner.post(`/api/journals/${shown.id}/readings`, {
      id: 'not-a-uuid',
      takenAt: 'yesterday',
      ph: 12,
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(
      expect.arrayContaining(['id', 'takenAt', 'ph']),
    );
  });

  it('stores a replayed reading once: 201 first, then 200 with the same reading', async () => {
    const owner = await member();
    const j = await postJournal(owner);
    const reading = { id: randomUUID(), takenAt: '2026-01-10T10:00:00.250Z', tempC: 31.4, ph: 6.6 };
    const first = await owner.post(`/api/journals/${j.id}/readings`, reading);
    expect(first.status).toBe(201);
    expect(first.body).toEqual({ ...reading, stepIndex: null, note: '' });
    const replay = await owner.post(`/api/journals/${j.id}/readings`, { ...reading, tempC: 99 });
    expect(replay.status).toBe(200);
    expect(replay.body).toEqual(first.body);
    const journal: JournalDto = (await owner.get(`/api/journals/${j.id}`)).body;
    expect(journal.readings).toEqual([first.body]);
  });

  it('refuses a reading id that belongs to another journal (409)', async () => {
    const owner = await member();
    const a = await postJournal(owner);
    const b = await postJournal(owner);
    const reading = { id: randomUUID(), takenAt: '2026-01-10T10:00:00Z', tempC: 31 };
    await expectStatus(owner.post(`/api/journals/${a.id}/readings`, reading), 201);
    const res = await owner.post(`/api/journals/${b.id}/readings`, reading);
    expect(res.status).toBe(409);
  });

  it('takes a batch from the offline queue, stores each once and re-derives the cook ramp', async () => {
    const owner = await member();
    const j = await postJournal(owner);
    // cooking 31 °C to 38 °C: 1 °C per 5 min for 20 minutes, then 3 °C in 5 minutes
    const at = (minute: number) => new Date(Date.UTC(2026, 0, 10, 11, minute)).toISOString();
    const readings = [0, 5, 10, 15, 20, 25].map((minute, i) => ({
      id: randomUUID(),
      takenAt: at(minute),
      tempC: [31, 32, 33, 34, 35, 38][i],
      stepIndex: 4,
    }));
    const first = await owner.post(`/api/journals/${j.id}/readings/batch`, {
      readings: readings.slice(0, 4),
    });
    expect(first.status).toBe(201);
    expect(first.body.created).toBe(4);
    const second = await owner.post(`/api/journals/${j.id}/readings/batch`, { readings });
    expect(second.status).toBe(201);
    expect(second.body.created).toBe(2);
    expect(second.body.readings.map((r: { id: string }) => r.id)).toEqual(
      readings.map((r) => r.id),
    );
    const replay = await owner.post(`/api/journals/${j.id}/readings/batch`, { readings });
    expect(replay.status).toBe(200);
    expect(replay.body.created).toBe(0);
    const journal: JournalDto = (await owner.get(`/api/journals/${j.id}`)).body;
    expect(journal.readings).toHaveLength(6);
    expect(journal.derived.ramp.fastestCPer5Min).toBeCloseTo(3, 9);
    expect(journal.derived.ramp.tooFast).toHaveLength(1);
    const [row] = await t.ctx.database.db.select().from(journals).where(eq(journals.id, j.id));
    expect(row.metricCookRampCPer5Min).toBeCloseTo(3, 9);
    const empty = await owner.post(`/api/journals/${j.id}/readings/batch`, { readings: [] });
    expect(empty.status).toBe(400);
  });
});

describe('POST /api/journals/:id/weigh-ins', () => {
  it('appends a weigh-in for the owner and re-derives yield and moisture loss', async () => {
    const owner = await member();
    const other = await member();
    const j = (await expectStatus(owner.post('/api/journals', publicJournalDocument()), 201)).body;
    const weighIn = { date: '2026-02-10', massKg: toKilograms(4, 'lb') * 0.9 };
    expect((await visitor(t.app).post(`/api/journals/${j.id}/weigh-ins`, weighIn)).status).toBe(
      401,
    );
    expect((await other.post(`/api/journals/${j.id}/weigh-ins`, weighIn)).status).toBe(403);
    const bad = await owner.post(`/api/journals/${j.id}/weigh-ins`, { date: '10/02', massKg: 0 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['date', 'massKg']);
    const res = await owner.post(`/api/journals/${j.id}/weigh-ins`, weighIn);
    expect(res.status).toBe(201);
    expect(res.body.weighIns).toEqual([{ ...weighIn, note: '' }]);
    expect(res.body.derived.moisture.lossSinceGreenPercent).toBeCloseTo(10, 9);
    const [row] = await t.ctx.database.db.select().from(journals).where(eq(journals.id, j.id));
    expect(row.metricMoistureLossPercent).toBeCloseTo(10, 9);
  });
});

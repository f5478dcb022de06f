import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { journals, styles } from '../../server/db/schema';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { signedIn } from '../support/factories';
import { journalDocument, putJournal } from '../support/journal-factory';
import { daysAgo, insertJournalRow } from '../support/journal-rows';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

const card = (over: Record<string, unknown> = {}) => ({
  tastedOn: daysAgo(0),
  overall: 7,
  appearance: 6,
  aroma: 7,
  flavour: 8,
  texture: 6,
  finish: 7,
  descriptors: ['nutty', 'milkfat'],
  defects: [],
  notes: 'Clean and *nutty*. <script>alert(1)</script>',
  ...over,
});

describe('POST /api/journals/:id/tastings', () => {
  it('refuses signed-out (401) and unverified members (403)', async () => {
    const owner = await signedIn(t.app, t.ctx);
    const id = await insertJournalRow(t.ctx, owner.member.id);
    expect((await visitor(t.app).post(`/api/journals/${id}/tastings`, card())).status).toBe(401);
    const unverified = await signedIn(t.app, t.ctx, { verified: false });
    const own = await insertJournalRow(t.ctx, unverified.member.id);
    const res = await unverified.post(`/api/journals/${own}/tastings`, card());
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('EMAIL_NOT_VERIFIED');
  });

  it('validates every score as an integer from 1 to 9, with a message per field', async () => {
    const owner = await signedIn(t.app, t.ctx);
    const id = await insertJournalRow(t.ctx, owner.member.id);
    const res = await owner.post(
      `/api/journals/${id}/tastings`,
      card({ overall: 0, appearance: 10, aroma: 6.5, flavour: '7', descriptors: ['smoky-bacon'] }),
    );
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      'appearance',
      'aroma',
      'descriptors.0',
      'flavour',
      'overall',
    ]);
  });

  it('refuses a tasting dated before the make or in the future', async () => {
    const owner = await signedIn(t.app, t.ctx);
    const id = await insertJournalRow(t.ctx, owner.member.id, { makeDate: daysAgo(10) });
    const before = await owner.post(
      `/api/journals/${id}/tastings`,
      card({ tastedOn: daysAgo(11) }),
    );
    expect(before.status).toBe(400);
    expect(before.body.error.fields.tastedOn).toMatch(/before/);
    const future = await owner.post(
      `/api/journals/${id}/tastings`,
      card({ tastedOn: daysAgo(-5) }),
    );
    expect(future.status).toBe(400);
  });

  it("stores the owner's tasting with the age from the make date, sanitised notes, and updates the journal", async () => {
    const owner = await signedIn(t.app, t.ctx);
    const id = await insertJournalRow(t.ctx, owner.member.id, { makeDate: daysAgo(122) });
    const res = await owner.post(`/api/journals/${id}/tastings`, card({ tastedOn: daysAgo(2) }));
    expect(res.status).toBe(201);
    expect(res.body.tasting).toMatchObject({
      ageDays: 120,
      overall: 7,
      descriptors: ['nutty', 'milkfat'],
      canEdit: true,
    });
    expect(res.body.tasting.notesHtml).toContain('<em>nutty</em>');
    expect(res.body.tasting.notesHtml).not.toContain('<script');
    const [row] = await t.ctx.database.db.select().from(journals).where(eq(journals.id, id));
    expect(row).toMatchObject({
      tastingCount: 1,
      meanOverall: 7,
      lastTastedAgeDays: 120,
      wheelStatus: 'opened',
    });
  });

  it('moves the ages of its tastings when the maker corrects the make date', async () => {
    const owner = await signedIn(t.app, t.ctx);
    const doc = journalDocument({ makeDate: daysAgo(100) });
    const created = await owner.post('/api/journals', doc);
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    expect(
      (await owner.post(`/api/journals/${id}/tastings`, card({ tastedOn: daysAgo(10) }))).status,
    ).toBe(201);
    const before = await owner.get(`/api/journals/${id}`).expect(200);
    const put = await putJournal(
      owner,
      id,
      { ...doc, makeDate: daysAgo(130) },
      before.body.version,
    );
    expect(put.status).toBe(200);
    const list = await owner.get(`/api/journals/${id}/tastings`).expect(200);
    expect(list.body.tastings.map((x: { ageDays: number }) => x.ageDays)).toEqual([120]);
    const [row] = await t.ctx.database.db.select().from(journals).where(eq(journals.id, id));
    expect(row.lastTastedAgeDays).toBe(120);
  });

  it('lets other verified members score only with a live invite, several times over the months', async () => {
    const owner = await signedIn(t.app, t.ctx);
    const friend = await signedIn(t.app, t.ctx);
    const id = await insertJournalRow(t.ctx, owner.member.id, { makeDate: daysAgo(200) });
    const refused = await friend.post(`/api/journals/${id}/tastings`, card());
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('INVITE_REQUIRED');
    expect((await friend.post(`/api/journals/${id}/invites`)).status).toBe(403);
    const invite = await owner.post(`/api/journals/${id}/invites`);
    expect(invite.status).toBe(201);
    expect(invite.body.invite.url).toContain(`/journals/${id}/taste?invite=`);
    const code = invite.body.invite.code as string;
    expect(
      (
        await friend.post(
          `/api/journals/${id}/tastings`,
          card({ invite: 'wrong-code', overall: 5 }),
        )
      ).status,
    ).toBe(403);
    expect(
      (
        await friend.post(
          `/api/journals/${id}/tastings`,
          card({ invite: code, overall: 5, tastedOn: daysAgo(100) }),
        )
      ).status,
    ).toBe(201);
    expect(
      (await friend.post(`/api/journals/${id}/tastings`, card({ invite: code, overall: 8 })))
        .status,
    ).toBe(201);
    const list = await visitor(t.app).get(`/api/journals/${id}/tastings`).expect(200);
    expect(list.body.tastings.map((x: { ageDays: number }) => x.ageDays)).toEqual([100, 200]);
    expect(list.body.bands.map((b: { label: string; n: number }) => [b.label, b.n])).toEqual([
      ['3 to 6 months', 1],
      ['6 to 12 months', 1],
    ]);
    const [row] = await t.ctx.database.db.select().from(journals).where(eq(journals.id, id));
    expect(row.meanOverall).toBe(6.5);
  });

  it('hides tastings of private journals from everyone but the owner (404)', async () => {
    const owner = await signedIn(t.app, t.ctx);
    const id = await insertJournalRow(t.ctx, owner.member.id, { visibility: 'private' });
    expect((await visitor(t.app).get(`/api/journals/${id}/tastings`)).status).toBe(404);
    expect((await (await signedIn(t.app, t.ctx)).get(`/api/journals/${id}/tastings`)).status).toBe(
      404,
    );
    expect((await owner.get(`/api/journals/${id}/tastings`)).status).toBe(200);
    expect((await visitor(t.app).get('/api/journals/abc/tastings')).status).toBe(400);
  });
});

describe('PATCH and DELETE /api/tastings/:id', () => {
  it('lets the taster and moderators edit, nobody else', async () => {
    const owner = await signedIn(t.app, t.ctx);
    const id = await insertJournalRow(t.ctx, owner.member.id);
    const created = await owner.post(`/api/journals/${id}/tastings`, card());
    const tastingId = created.body.tasting.id as number;
    const other = await signedIn(t.app, t.ctx);
    expect((await other.patch(`/api/tastings/${tastingId}`, { overall: 1 })).status).toBe(403);
    expect((await visitor(t.app).patch(`/api/tastings/${tastingId}`, { overall: 1 })).status).toBe(
      401,
    );
    expect((await owner.patch(`/api/tastings/${tastingId}`, { overall: 12 })).status).toBe(400);
    const ok = await owner.patch(`/api/tastings/${tastingId}`, { overall: 9 });
    expect(ok.status).toBe(200);
    expect(ok.body.tasting.overall).toBe(9);
    const moderator = await signedIn(t.app, t.ctx, { role: 'moderator' });
    expect(
      (await moderator.patch(`/api/tastings/${tastingId}`, { notes: 'Edited by a moderator.' }))
        .status,
    ).toBe(200);
    expect((await other.delete(`/api/tastings/${tastingId}`)).status).toBe(403);
    expect((await owner.delete(`/api/tastings/${tastingId}`)).status).toBe(204);
    expect((await owner.delete(`/api/tastings/${tastingId}`)).status).toBe(404);
    const [row] = await t.ctx.database.db.select().from(journals).where(eq(journals.id, id));
    expect(row).toMatchObject({ tastingCount: 0, meanOverall: null });
  });
});

describe('POST /api/journals/:id/invites', () => {
  it('refuses a signed-out caller (401) and a bad journal id (400)', async () => {
    expect((await visitor(t.app).post('/api/journals/1/invites')).status).toBe(401);
    const owner = await signedIn(t.app, t.ctx);
    const bad = await owner.post('/api/journals/not-a-number/invites');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.id).toBeDefined();
  });

  it('refuses (409, with the reason) an invite to a draft, a private or a hidden journal, which an invited taster could not open', async () => {
    const owner = await signedIn(t.app, t.ctx);
    const friend = await signedIn(t.app, t.ctx);
    const cases = [
      [{ status: 'draft' as const, publishedAt: null }, /draft.*Publish it first/],
      [{ visibility: 'private' as const }, /private.*public or unlisted/],
      [{ hiddenAt: new Date() }, /moderator has hidden/],
    ] as const;
    for (const [over, reason] of cases) {
      const id = await insertJournalRow(t.ctx, owner.member.id, over);
      const res = await owner.post(`/api/journals/${id}/invites`);
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('JOURNAL_NOT_OPEN_TO_TASTERS');
      expect(res.body.error.message).toMatch(reason);
      // The maker's tasting list says the same, so the page explains instead of offering the button.
      const list = await owner.get(`/api/journals/${id}/tastings`).expect(200);
      expect(list.body.invites.blockedReason).toMatch(reason);
      // Nothing about the journal leaks to the friend.
      expect((await friend.get(`/api/journals/${id}`)).status).toBe(404);
      expect((await friend.get(`/api/journals/${id}/tastings`)).status).toBe(404);
    }
  });

  it('makes invites for published public and unlisted journals, which the invitee can open; only the maker learns about invites', async () => {
    const owner = await signedIn(t.app, t.ctx);
    const friend = await signedIn(t.app, t.ctx);
    for (const visibility of ['public', 'unlisted'] as const) {
      const id = await insertJournalRow(t.ctx, owner.member.id, { visibility });
      expect((await owner.post(`/api/journals/${id}/invites`)).status).toBe(201);
      const mine = await owner.get(`/api/journals/${id}/tastings`).expect(200);
      expect(mine.body.invites).toEqual({ blockedReason: null });
      expect((await friend.get(`/api/journals/${id}`)).status).toBe(200);
      const theirs = await friend.get(`/api/journals/${id}/tastings`).expect(200);
      expect(theirs.body.invites).toBeUndefined();
    }
  });
});

describe('defects by style', () => {
  const styleId = async (slug: string) =>
    (await t.ctx.database.db.select({ id: styles.id }).from(styles).where(eq(styles.slug, slug)))[0]
      .id;

  it("refuses a style's own trait as a defect (crumbly for a Caerphilly-type), with a message on the field; cheddar keeps it", async () => {
    const owner = await signedIn(t.app, t.ctx);
    const caerphilly = await insertJournalRow(t.ctx, owner.member.id, {
      styleId: await styleId('caerphilly'),
    });
    const refused = await owner.post(
      `/api/journals/${caerphilly}/tastings`,
      card({ defects: ['bitter', 'crumbly'] }),
    );
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.defects).toMatch(
      /Crumbly is typical of a Caerphilly-type, so it is not counted as a defect/,
    );
    const saved = await owner.post(
      `/api/journals/${caerphilly}/tastings`,
      card({ defects: ['bitter'] }),
    );
    expect(saved.status).toBe(201);
    const patched = await owner.patch(`/api/tastings/${saved.body.tasting.id}`, {
      defects: ['crumbly'],
    });
    expect(patched.status).toBe(400);
    expect(patched.body.error.fields.defects).toMatch(/Caerphilly-type/);

    const cheddar = await insertJournalRow(t.ctx, owner.member.id);
    const crumblyCheddar = await owner.post(
      `/api/journals/${cheddar}/tastings`,
      card({ defects: ['crumbly'] }),
    );
    expect(crumblyCheddar.status).toBe(201);
    expect(crumblyCheddar.body.tasting.defects).toEqual(['crumbly']);
  });
});

import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { journals } from '../../server/db/schema';
import { createTestApp, visitor, type TestApp, type Visitor } from '../support/app';
import { expectFactsUpToDate } from '../support/compare-facts';
import { GOOD_PASSWORD, signedIn } from '../support/factories';
import {
  expectStatus,
  postJournal,
  publicJournalDocument,
  putJournal,
} from '../support/journal-factory';

// Compare reads compare_facts (one row per journal with its visible tastings' sums): every
// kind of write must move its answer at once, and leave the facts equal to a from-scratch
// computation.
let t: TestApp;
let moderator: Visitor;
beforeAll(async () => {
  t = await createTestApp();
  moderator = await signedIn(t.app, t.ctx, { role: 'moderator' });
});
afterAll(() => t.close());

type Member = Awaited<ReturnType<typeof signedIn>>;
type Point = { x: number; y: number; journalId: number; tastingId: number | null };

const scores = (overall: number) => ({
  overall,
  appearance: 6,
  aroma: 6,
  flavour: overall,
  texture: 6,
  finish: 6,
});

async function addTasting(v: Visitor, journalId: number, overall: number, extra = {}) {
  const res = await expectStatus(
    v.post(`/api/journals/${journalId}/tastings`, {
      tastedOn: '2026-04-10',
      ...scores(overall),
      ...extra,
    }),
    201,
  );
  return res.body.tasting.id as number;
}

async function compareOf(maker: Member, as: Visitor = visitor(t.app)) {
  const res = await as
    .get(`/api/compare?x=saltPerLitre&y=overall&per=tasting&maker=${maker.member.handle}`)
    .expect(200);
  return res.body as { n: number; points: Point[]; fit: unknown };
}

async function saltOf(journalId: number) {
  const [row] = await t.ctx.database.db
    .select({ salt: journals.metricSaltGPerL })
    .from(journals)
    .where(eq(journals.id, journalId));
  return row.salt;
}

async function reportAndAct(
  reporter: Visitor,
  targetType: 'journal' | 'tasting',
  targetId: number,
  action: 'hide' | 'restore',
  reportId?: number,
) {
  let id = reportId;
  if (id === undefined) {
    const report = await expectStatus(
      reporter.post('/api/reports', { targetType, targetId, reason: 'other', details: 'Check' }),
      201,
    );
    id = report.body.report.id as number;
  }
  await expectStatus(
    moderator.post(`/api/moderation/reports/${id}/actions`, { action, note: 'Looked at it' }),
    200,
  );
  return id;
}

// The document version a PUT must name (a tasting by the owner opens the wheel, so it moves).
async function versionOf(maker: Member, journalId: number) {
  return (await maker.get(`/api/journals/${journalId}`).expect(200)).body.version as string;
}

async function publicJournal(maker: Member, overrides = {}) {
  return (await postJournal(maker, publicJournalDocument(overrides))) as {
    id: number;
  };
}

describe('Compare after each kind of write', () => {
  it('follows tastings added, changed and deleted through the API', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const journal = await publicJournal(maker);
    expect((await compareOf(maker)).n).toBe(0);
    const first = await addTasting(maker, journal.id, 6);
    let answer = await compareOf(maker);
    expect(answer.points).toEqual([
      expect.objectContaining({ journalId: journal.id, tastingId: first, y: 6 }),
    ]);
    expect(answer.points[0].x).toBeCloseTo((await saltOf(journal.id))!, 9);
    await expectFactsUpToDate(t.ctx, [journal.id]);

    await expectStatus(maker.patch(`/api/tastings/${first}`, { overall: 8 }), 200);
    expect((await compareOf(maker)).points.map((p) => p.y)).toEqual([8]);
    const second = await addTasting(maker, journal.id, 4);
    answer = await compareOf(maker);
    expect(answer.points.map((p) => [p.tastingId, p.y])).toEqual([
      [first, 8],
      [second, 4],
    ]);
    await expectFactsUpToDate(t.ctx, [journal.id]);

    await expectStatus(maker.delete(`/api/tastings/${first}`), 204);
    expect((await compareOf(maker)).points.map((p) => p.tastingId)).toEqual([second]);
    await expectFactsUpToDate(t.ctx, [journal.id]);
  });

  it('drops a tasting a moderator hides, and takes it back when restored', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const journal = await publicJournal(maker);
    const kept = await addTasting(maker, journal.id, 5);
    const hidden = await addTasting(maker, journal.id, 9);
    expect((await compareOf(maker)).n).toBe(2);
    const reporter = await signedIn(t.app, t.ctx);
    const reportId = await reportAndAct(reporter, 'tasting', hidden, 'hide');
    // For everyone, the maker included: a hidden tasting never counts in Compare.
    for (const as of [visitor(t.app), maker]) {
      const answer = await compareOf(maker, as);
      expect(answer.n).toBe(1);
      expect(answer.points.map((p) => p.tastingId)).toEqual([kept]);
    }
    await expectFactsUpToDate(t.ctx, [journal.id]);
    await reportAndAct(reporter, 'tasting', hidden, 'restore', reportId);
    expect((await compareOf(maker)).points.map((p) => p.tastingId)).toEqual([kept, hidden]);
    await expectFactsUpToDate(t.ctx, [journal.id]);
  });

  it('drops a journal made private or taken back to draft for others, never for its maker', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const doc = publicJournalDocument();
    const journal = await publicJournal(maker, doc);
    await addTasting(maker, journal.id, 7);
    const stranger = await signedIn(t.app, t.ctx);
    expect((await compareOf(maker, stranger)).n).toBe(1);

    const priv = await expectStatus(
      putJournal(
        maker,
        journal.id,
        { ...doc, visibility: 'private' },
        await versionOf(maker, journal.id),
      ),
      200,
    );
    expect((await compareOf(maker)).n).toBe(0);
    expect((await compareOf(maker, stranger)).n).toBe(0);
    expect((await compareOf(maker, maker)).n).toBe(1);
    await expectFactsUpToDate(t.ctx, [journal.id]);

    const draft = await expectStatus(
      putJournal(maker, journal.id, { ...doc, status: 'draft' }, priv.body.version),
      200,
    );
    expect((await compareOf(maker, stranger)).n).toBe(0);
    expect((await compareOf(maker, maker)).n).toBe(1);
    await expectStatus(putJournal(maker, journal.id, doc, draft.body.version), 200);
    expect((await compareOf(maker, stranger)).n).toBe(1);
    await expectFactsUpToDate(t.ctx, [journal.id]);
  });

  it('moves the point when the salt is edited', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const doc = publicJournalDocument();
    const journal = await publicJournal(maker, doc);
    await addTasting(maker, journal.id, 7);
    const before = (await compareOf(maker)).points[0].x;
    const salted = {
      ...doc,
      ingredients: doc.ingredients!.map((i) => (i.kind === 'salt' ? { ...i, amount: 2 } : i)),
    };
    await expectStatus(
      putJournal(maker, journal.id, salted, await versionOf(maker, journal.id)),
      200,
    );
    const after = (await compareOf(maker)).points[0].x;
    expect(after).toBeCloseTo(before * 2, 6);
    expect(after).toBeCloseTo((await saltOf(journal.id))!, 9);
    await expectFactsUpToDate(t.ctx, [journal.id]);
  });

  it('drops a journal a moderator hides (its maker still sees it) and one its maker deletes', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const hiddenJournal = await publicJournal(maker);
    const deletedJournal = await publicJournal(maker);
    await addTasting(maker, hiddenJournal.id, 6);
    await addTasting(maker, deletedJournal.id, 8);
    expect((await compareOf(maker)).n).toBe(2);

    await reportAndAct(await signedIn(t.app, t.ctx), 'journal', hiddenJournal.id, 'hide');
    const open = await compareOf(maker);
    expect(open.points.map((p) => p.journalId)).toEqual([deletedJournal.id]);
    expect((await compareOf(maker, moderator)).n).toBe(1);
    expect((await compareOf(maker, maker)).n).toBe(2);

    await expectStatus(maker.delete(`/api/journals/${deletedJournal.id}`), 204);
    expect((await compareOf(maker, maker)).points.map((p) => p.journalId)).toEqual([
      hiddenJournal.id,
    ]);
    await expectFactsUpToDate(t.ctx, [hiddenJournal.id, deletedJournal.id]);
  });

  it("takes a deleted account's tastings out of other makers' journals", async () => {
    const maker = await signedIn(t.app, t.ctx);
    const journal = await publicJournal(maker);
    await addTasting(maker, journal.id, 6);
    const invite = await expectStatus(maker.post(`/api/journals/${journal.id}/invites`), 201);
    const guest = await signedIn(t.app, t.ctx);
    await addTasting(guest, journal.id, 9, { invite: invite.body.invite.code });
    expect((await compareOf(maker)).n).toBe(2);

    await expectStatus(guest.delete('/api/auth/me', { password: GOOD_PASSWORD }), 204);
    const answer = await compareOf(maker);
    expect(answer.n).toBe(1);
    expect(answer.points[0].y).toBe(6);
    await expectFactsUpToDate(t.ctx, [journal.id]);
  });
});

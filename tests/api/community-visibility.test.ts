// Hidden items vanish for everyone but their author and moderators: from every list, search,
// feed, count and comparison. One scene, hidden through the moderation queue, read by each
// kind of viewer across every route that lists or counts.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { refreshJournalTastingStats } from '../../server/repositories/tastings.repository';
import { createTestApp, visitor, type TestApp, type Visitor } from '../support/app';
import { signedIn, unique } from '../support/factories';
import { insertCommentRow, insertPhotoRow, insertTastingRow } from '../support/community-factory';
import { insertJournalRow } from '../support/journal-rows';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

type Agent = Awaited<ReturnType<typeof signedIn>>;
type Scene = Awaited<ReturnType<typeof buildScene>>;

async function buildScene() {
  const word = `zq${unique()}`;
  const maker = await signedIn(t.app, t.ctx);
  const taster = await signedIn(t.app, t.ctx);
  const commenter = await signedIn(t.app, t.ctx);
  const follower = await signedIn(t.app, t.ctx);
  const stranger = await signedIn(t.app, t.ctx);
  const reporter = await signedIn(t.app, t.ctx);
  const moderator = await signedIn(t.app, t.ctx, { role: 'moderator' });
  await follower.post(`/api/members/${maker.member.handle}/follow`);

  const hiddenJournal = await insertJournalRow(t.ctx, maker.member.id, {
    title: `Hidden ${word} cheddar`,
    metricSaltGPerL: 1.5,
  });
  const shownJournal = await insertJournalRow(t.ctx, maker.member.id, {
    title: `Shown ${word} cheddar`,
    metricSaltGPerL: 2,
  });
  await insertTastingRow(t.ctx, hiddenJournal, taster.member.id, 9);
  await insertTastingRow(t.ctx, shownJournal, taster.member.id, 8);
  const hiddenTasting = await insertTastingRow(t.ctx, shownJournal, taster.member.id, 2);
  await refreshJournalTastingStats(t.ctx.database.db, hiddenJournal);
  await refreshJournalTastingStats(t.ctx.database.db, shownJournal);
  const shownComment = await insertCommentRow(t.ctx, shownJournal, commenter.member.id, {
    body: 'Lovely paste.',
  });
  const hiddenComment = await insertCommentRow(t.ctx, shownJournal, commenter.member.id, {
    body: 'Rude words here.',
  });
  const hiddenPhoto = await insertPhotoRow(t.ctx, shownJournal);
  await insertCommentRow(t.ctx, hiddenJournal, commenter.member.id);

  // Hide through the queue, as a moderator would.
  const reports: Record<string, number> = {};
  for (const [targetType, targetId] of [
    ['journal', hiddenJournal],
    ['tasting', hiddenTasting],
    ['comment', hiddenComment],
    ['photo', hiddenPhoto],
  ] as const) {
    const res = await reporter.post('/api/reports', { targetType, targetId, reason: 'abusive' });
    expect(res.status).toBe(201);
    reports[targetType] = res.body.report.id;
    const hid = await moderator.post(`/api/moderation/reports/${res.body.report.id}/actions`, {
      action: 'hide',
      note: 'Hidden for the test.',
    });
    expect(hid.status).toBe(200);
  }
  return {
    word,
    maker,
    taster,
    commenter,
    follower,
    stranger,
    moderator,
    hiddenJournal,
    shownJournal,
    hiddenTasting,
    shownComment,
    hiddenComment,
    hiddenPhoto,
    reports,
  };
}

const ids = (items: { id: number }[]) => items.map((i) => i.id);

/** Everything a viewer who is neither an author nor staff may see, checked route by route. */
async function expectGoneFor(who: Visitor | Agent, s: Scene, label: string) {
  const handle = s.maker.member.handle;
  const list = await who.get(`/api/journals?maker=@${handle}`).expect(200);
  expect(ids(list.body.items), `${label}: Discover`).toEqual([s.shownJournal]);
  expect(list.body.total).toBe(1);
  const shownCard = list.body.items[0];
  expect(shownCard, `${label}: card counts`).toMatchObject({ tastingCount: 1, meanOverall: 8 });
  expect(shownCard.cover, `${label}: card cover`).toBeNull();

  const search = await who.get(`/api/journals?q=${s.word}`).expect(200);
  expect(ids(search.body.items), `${label}: search`).toEqual([s.shownJournal]);

  const profile = (await who.get(`/api/members/${handle}`).expect(200)).body.profile;
  expect(ids(profile.journals), `${label}: profile journals`).toEqual([s.shownJournal]);
  expect(profile.counts.journals).toBe(1);
  expect(profile.topStyles).toEqual([{ slug: 'cheddar', name: 'Cheddar', count: 1 }]);
  expect(profile.scores.received, `${label}: profile scores`).toEqual({ mean: 8, n: 1 });
  const tasterProfile = (await who.get(`/api/members/${s.taster.member.handle}`).expect(200)).body
    .profile;
  expect(ids(tasterProfile.tastings), `${label}: taster's profile`).not.toContain(s.hiddenTasting);
  expect(tasterProfile.counts.tastings).toBe(1);
  expect(tasterProfile.scores.given).toEqual({ mean: 8, n: 1 });

  const compare = await who
    .get(`/api/compare?x=saltPerLitre&y=overall&per=tasting&maker=${handle}`)
    .expect(200);
  expect(compare.body.n, `${label}: compare`).toBe(1);
  expect(compare.body.points.map((p: { journalId: number }) => p.journalId)).toEqual([
    s.shownJournal,
  ]);
  const perJournal = await who
    .get(`/api/compare?x=saltPerLitre&y=overall&per=journal&maker=${handle}`)
    .expect(200);
  expect(
    perJournal.body.points.map((p: { y: number }) => p.y),
    `${label}: compare mean`,
  ).toEqual([8]);
  const side = await who.get(`/api/compare/journals?ids=${s.shownJournal},${s.hiddenJournal}`);
  expect(side.status, `${label}: side by side`).toBe(404);

  const journal = await who.get(`/api/journals/${s.shownJournal}`).expect(200);
  expect(ids(journal.body.photos), `${label}: photos`).toEqual([]);
  expect(journal.body).toMatchObject({ tastingCount: 1, meanOverall: 8 });
  const tastings = await who.get(`/api/journals/${s.shownJournal}/tastings`).expect(200);
  expect(ids(tastings.body.tastings), `${label}: tastings`).not.toContain(s.hiddenTasting);
  expect(tastings.body.bands.reduce((n: number, b: { n: number }) => n + b.n, 0)).toBe(1);
  const comments = await who.get(`/api/journals/${s.shownJournal}/comments`).expect(200);
  expect(ids(comments.body.items), `${label}: comments`).toEqual([s.shownComment]);
  expect(comments.body.total).toBe(1);
  expect(JSON.stringify(comments.body)).not.toContain('Rude words');

  for (const path of ['', '/tastings', '/comments']) {
    const res = await who.get(`/api/journals/${s.hiddenJournal}${path}`);
    expect(res.status, `${label}: hidden journal ${path || 'page'}`).toBe(404);
  }
}

describe('hidden items', () => {
  let s: Scene;
  beforeAll(async () => {
    s = await buildScene();
  });

  it('vanish for visitors, other members and followers from every list, search, feed, count and comparison', async () => {
    await expectGoneFor(visitor(t.app), s, 'visitor');
    await expectGoneFor(s.stranger, s, 'member');
    await expectGoneFor(s.follower, s, 'follower');
    const feed = await s.follower.get('/api/feed').expect(200);
    expect(ids(feed.body.items), 'feed').toEqual([s.shownJournal]);
    expect(feed.body.total).toBe(1);
  });

  it('stay visible to their authors', async () => {
    const { maker, taster, commenter } = s;
    expect((await maker.get(`/api/journals/${s.hiddenJournal}`)).status).toBe(200);
    const mine = await maker.get('/api/journals?mine=true').expect(200);
    expect(ids(mine.body.items)).toContain(s.hiddenJournal);
    const own = await maker.get(`/api/journals/${s.shownJournal}`).expect(200);
    expect(ids(own.body.photos)).toEqual([s.hiddenPhoto]);
    const tasted = await taster.get(`/api/journals/${s.shownJournal}/tastings`).expect(200);
    expect(ids(tasted.body.tastings)).toContain(s.hiddenTasting);
    const said = await commenter.get(`/api/journals/${s.shownJournal}/comments`).expect(200);
    expect(said.body.items.map((c: { id: number; state: string }) => [c.id, c.state])).toEqual([
      [s.shownComment, 'visible'],
      [s.hiddenComment, 'hidden'],
    ]);
    // The owner of the journal is not the author of the hidden tasting or comment.
    const ownerTastings = await maker.get(`/api/journals/${s.shownJournal}/tastings`).expect(200);
    expect(ids(ownerTastings.body.tastings)).not.toContain(s.hiddenTasting);
    const ownerComments = await maker.get(`/api/journals/${s.shownJournal}/comments`).expect(200);
    expect(ids(ownerComments.body.items)).toEqual([s.shownComment]);
    // Each author was told, with the moderator's note.
    for (const who of [maker, taster, commenter]) {
      const notices = (await who.get('/api/notifications').expect(200)).body.items;
      expect(notices.filter((n: { kind: string }) => n.kind === 'hidden').length).toBeGreaterThan(
        0,
      );
      expect(notices.find((n: { kind: string }) => n.kind === 'hidden').text).toBe(
        'Hidden for the test.',
      );
    }
  });

  it('stay visible to moderators on the item pages, and stay out of listings for everyone', async () => {
    const { moderator } = s;
    expect((await moderator.get(`/api/journals/${s.hiddenJournal}`)).status).toBe(200);
    expect((await moderator.get(`/api/journals/${s.hiddenJournal}/comments`)).status).toBe(200);
    const j = await moderator.get(`/api/journals/${s.shownJournal}`).expect(200);
    expect(ids(j.body.photos)).toEqual([s.hiddenPhoto]);
    const tastings = await moderator.get(`/api/journals/${s.shownJournal}/tastings`).expect(200);
    expect(ids(tastings.body.tastings)).toContain(s.hiddenTasting);
    const comments = await moderator.get(`/api/journals/${s.shownJournal}/comments`).expect(200);
    expect(comments.body.items.map((c: { state: string }) => c.state)).toEqual([
      'visible',
      'hidden',
    ]);
    for (const who of [moderator, s.maker]) {
      const list = await who.get(`/api/journals?q=${s.word}`).expect(200);
      expect(ids(list.body.items)).toEqual([s.shownJournal]);
    }
  });

  it('come back everywhere when restored, with the tasting aggregates recomputed', async () => {
    const { moderator } = s;
    for (const kind of ['journal', 'tasting', 'comment', 'photo']) {
      const res = await moderator.post(`/api/moderation/reports/${s.reports[kind]}/actions`, {
        action: 'restore',
      });
      expect(res.status).toBe(200);
    }
    const anon = visitor(t.app);
    const list = await anon.get(`/api/journals?maker=@${s.maker.member.handle}`).expect(200);
    expect(ids(list.body.items).sort()).toEqual([s.hiddenJournal, s.shownJournal].sort());
    const shown = await anon.get(`/api/journals/${s.shownJournal}`).expect(200);
    expect(shown.body).toMatchObject({ tastingCount: 2, meanOverall: 5 });
    expect(ids(shown.body.photos)).toEqual([s.hiddenPhoto]);
    const compare = await anon
      .get(`/api/compare?x=saltPerLitre&y=overall&per=tasting&maker=${s.maker.member.handle}`)
      .expect(200);
    expect(compare.body.n).toBe(3);
    const comments = await anon.get(`/api/journals/${s.shownJournal}/comments`).expect(200);
    expect(comments.body.total).toBe(2);
  });
});

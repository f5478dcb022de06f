import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { createMember, signedIn } from '../support/factories';
import { insertTastingRow, makeSeasoned, setBio } from '../support/community-factory';
import { insertJournalRow } from '../support/journal-rows';
import { eq } from 'drizzle-orm';
import { styles } from '../../server/db/schema';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

async function styleId(slug: string): Promise<number> {
  const [row] = await t.ctx.database.db.select().from(styles).where(eq(styles.slug, slug));
  return row.id;
}

describe('GET /api/members/:handle', () => {
  it('answers 404 for an unknown handle and 400 for one that cannot be a handle', async () => {
    expect((await visitor(t.app).get('/api/members/nobody-here-at-all')).status).toBe(404);
    const bad = await visitor(t.app).get('/api/members/Bad%20Handle!');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.handle).toBeTruthy();
  });

  it('shows name, sanitised bio, listed journals and tastings, counts, top styles and mean scores', async () => {
    const maker = await createMember(t.ctx);
    await setBio(
      t.ctx,
      maker.id,
      'Cheddars on **Saturdays**. <script>window.__x=1</script> ![me](https://example.test/me.png)',
    );
    const taster = await createMember(t.ctx);
    const tomme = await styleId('tomme');
    const a = await insertJournalRow(t.ctx, maker.id, { title: 'Cheddar one' });
    const b = await insertJournalRow(t.ctx, maker.id, { title: 'Cheddar two' });
    await insertJournalRow(t.ctx, maker.id, { title: 'Tomme one', styleId: tomme });
    await insertJournalRow(t.ctx, maker.id, { title: 'Private', visibility: 'private' });
    await insertJournalRow(t.ctx, maker.id, { title: 'Unlisted', visibility: 'unlisted' });
    await insertJournalRow(t.ctx, maker.id, { title: 'Draft', status: 'draft' });
    await insertTastingRow(t.ctx, a, taster.id, 8);
    await insertTastingRow(t.ctx, b, taster.id, 6);
    await insertTastingRow(t.ctx, a, maker.id, 7);
    const someoneElse = await createMember(t.ctx);
    const theirs = await insertJournalRow(t.ctx, someoneElse.id, { title: 'Their blue' });
    await insertTastingRow(t.ctx, theirs, maker.id, 5);

    const res = await visitor(t.app).get(`/api/members/@${maker.handle}`).expect(200);
    const p = res.body.profile;
    expect(p).toMatchObject({
      handle: maker.handle,
      displayName: maker.displayName,
      role: 'member',
      counts: { journals: 3, tastings: 2, followers: 0, following: 0 },
      topStyles: [
        { slug: 'cheddar', count: 2 },
        { slug: 'tomme', count: 1 },
      ],
      scores: { received: { mean: 7, n: 3 }, given: { mean: 6, n: 2 } },
      viewer: { signedIn: false, isSelf: false, follows: false },
    });
    expect(p.suspended).toBeUndefined();
    expect(p.bioHtml).toContain('<strong>Saturdays</strong>');
    expect(p.bioHtml).not.toMatch(/<script|<img/i);
    expect(p.journals.map((j: { title: string }) => j.title).sort()).toEqual([
      'Cheddar one',
      'Cheddar two',
      'Tomme one',
    ]);
    expect(p.tastings.map((x: { journal: { title: string } }) => x.journal.title).sort()).toEqual([
      'Cheddar one',
      'Their blue',
    ]);
    expect(JSON.stringify(p)).not.toContain(maker.email);
  });
});

describe('POST and DELETE /api/members/:handle/follow', () => {
  it('needs a signed-in member and refuses following yourself', async () => {
    const maker = await createMember(t.ctx);
    expect((await visitor(t.app).post(`/api/members/${maker.handle}/follow`)).status).toBe(401);
    expect((await visitor(t.app).delete(`/api/members/${maker.handle}/follow`)).status).toBe(401);
    const me = await signedIn(t.app, t.ctx);
    const self = await me.post(`/api/members/${me.member.handle}/follow`);
    expect(self.status).toBe(400);
    expect(self.body.error.code).toBe('CANNOT_FOLLOW_SELF');
    expect((await me.post('/api/members/no-such-maker-here/follow')).status).toBe(404);
  });

  it('follows and unfollows idempotently, telling the maker once', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const fan = await signedIn(t.app, t.ctx);
    const url = `/api/members/${maker.member.handle}/follow`;
    expect((await fan.post(url)).body).toEqual({ following: true, followers: 1 });
    expect((await fan.post(url)).body).toEqual({ following: true, followers: 1 });
    expect((await fan.delete(url)).body).toEqual({ following: false, followers: 0 });
    expect((await fan.delete(url)).body).toEqual({ following: false, followers: 0 });
    await fan.post(url);
    const notices = (await maker.get('/api/notifications').expect(200)).body.items;
    expect(notices).toHaveLength(1);
    expect(notices[0]).toMatchObject({
      kind: 'follow',
      actor: { handle: fan.member.handle },
      link: `/@${fan.member.handle}`,
    });
    const profile = await fan.get(`/api/members/${maker.member.handle}`).expect(200);
    expect(profile.body.profile.viewer).toEqual({ signedIn: true, isSelf: false, follows: true });
    expect(profile.body.profile.counts.followers).toBe(1);
    const fanProfile = await fan.get(`/api/members/${fan.member.handle}`).expect(200);
    expect(fanProfile.body.profile.viewer.isSelf).toBe(true);
    expect(fanProfile.body.profile.counts.following).toBe(1);
  });
});

describe('GET /api/feed', () => {
  it('needs a signed-in member and validates the page', async () => {
    expect((await visitor(t.app).get('/api/feed')).status).toBe(401);
    const me = await signedIn(t.app, t.ctx);
    expect((await me.get('/api/feed?pageSize=0')).status).toBe(400);
    expect((await me.get('/api/feed').expect(200)).body).toMatchObject({ items: [], total: 0 });
  });

  it('pages the listed journals of followed makers only, newest make first', async () => {
    const followed = await createMember(t.ctx);
    const stranger = await createMember(t.ctx);
    const me = await signedIn(t.app, t.ctx);
    expect((await me.post(`/api/members/${followed.handle}/follow`)).status).toBe(200);
    const days = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10);
    await insertJournalRow(t.ctx, followed.id, { title: 'Old', makeDate: days(40) });
    await insertJournalRow(t.ctx, followed.id, { title: 'New', makeDate: days(2) });
    await insertJournalRow(t.ctx, followed.id, { title: 'Mid', makeDate: days(20) });
    await insertJournalRow(t.ctx, followed.id, { title: 'Secret', visibility: 'private' });
    await insertJournalRow(t.ctx, followed.id, { title: 'Link only', visibility: 'unlisted' });
    await insertJournalRow(t.ctx, stranger.id, { title: 'Not followed' });
    const first = await me.get('/api/feed?pageSize=2').expect(200);
    expect(first.body.total).toBe(3);
    expect(first.body.items.map((j: { title: string }) => j.title)).toEqual(['New', 'Mid']);
    const second = await me.get('/api/feed?pageSize=2&page=2').expect(200);
    expect(second.body.items.map((j: { title: string }) => j.title)).toEqual(['Old']);
  });
});

describe('GET /api/notifications and POST /api/notifications/read', () => {
  it('needs a signed-in member', async () => {
    expect((await visitor(t.app).get('/api/notifications')).status).toBe(401);
    expect((await visitor(t.app).get('/api/notifications/count')).status).toBe(401);
    expect((await visitor(t.app).post('/api/notifications/read', { all: true })).status).toBe(401);
  });

  it('marks only the member’s own notifications read, some or all, and validates the request', async () => {
    const owner = await signedIn(t.app, t.ctx);
    const other = await signedIn(t.app, t.ctx);
    const journalId = await insertJournalRow(t.ctx, owner.member.id);
    const reader = await signedIn(t.app, t.ctx);
    // Never held, even if another file has "hold first comments" on just now.
    await makeSeasoned(t.ctx, reader.member.id);
    for (const body of ['One', 'Two', 'Three']) {
      expect((await reader.post(`/api/journals/${journalId}/comments`, { body })).status).toBe(201);
    }
    const otherJournal = await insertJournalRow(t.ctx, other.member.id);
    expect(
      (await reader.post(`/api/journals/${otherJournal}/comments`, { body: 'Hi' })).status,
    ).toBe(201);
    const list = await owner.get('/api/notifications').expect(200);
    expect(list.body).toMatchObject({ total: 3, unread: 3 });
    expect(list.body.items.map((n: { text: string }) => n.text)).toEqual(['Three', 'Two', 'One']);
    const otherIds = (await other.get('/api/notifications').expect(200)).body.items.map(
      (n: { id: number }) => n.id,
    );

    expect((await owner.post('/api/notifications/read', {})).status).toBe(400);
    expect((await owner.post('/api/notifications/read', { ids: ['x'] })).status).toBe(400);
    const some = await owner.post('/api/notifications/read', {
      ids: [list.body.items[0].id, ...otherIds],
    });
    expect(some.body).toEqual({ marked: 1, unread: 2 });
    expect((await other.get('/api/notifications/count').expect(200)).body.unread).toBe(1);
    const unreadOnly = await owner.get('/api/notifications?unread=true').expect(200);
    expect(unreadOnly.body.items).toHaveLength(2);
    expect((await owner.post('/api/notifications/read', { all: true })).body).toEqual({
      marked: 2,
      unread: 0,
    });
    const after = await owner.get('/api/notifications').expect(200);
    expect(after.body.items.every((n: { read: boolean }) => n.read)).toBe(true);
  });

  it('drops a comment notice once the comment is deleted', async () => {
    const owner = await signedIn(t.app, t.ctx);
    const journalId = await insertJournalRow(t.ctx, owner.member.id);
    const reader = await signedIn(t.app, t.ctx);
    // Never held, even if another file has "hold first comments" on just now.
    await makeSeasoned(t.ctx, reader.member.id);
    const posted = await reader.post(`/api/journals/${journalId}/comments`, { body: 'Oops' });
    expect((await owner.get('/api/notifications/count')).body.unread).toBe(1);
    expect((await reader.delete(`/api/comments/${posted.body.comment.id}`)).status).toBe(204);
    expect((await owner.get('/api/notifications/count')).body.unread).toBe(0);
  });
});

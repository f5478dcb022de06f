import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { comments, users } from '../../server/db/schema';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { signedIn } from '../support/factories';
import { insertCommentRow, makeSeasoned } from '../support/community-factory';
import { insertJournalRow } from '../support/journal-rows';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

type Mail = { to: string[]; subject: string; text: string; html: string };

/** The newest message to an address whose subject matches, waiting a little (sent unawaited). */
async function mailTo(email: string, subject: RegExp, waitMs = 3000): Promise<Mail | undefined> {
  const until = Date.now() + waitMs;
  for (;;) {
    const found = t.ctx.mailbox
      ?.list()
      .find((m) => m.to.includes(email) && subject.test(m.subject));
    if (found || Date.now() > until) return found as Mail | undefined;
    await new Promise((r) => setTimeout(r, 50));
  }
}

const path = (journalId: number) => `/api/journals/${journalId}/comments`;

async function ownerWithJournal(overrides = {}) {
  const owner = await signedIn(t.app, t.ctx);
  const journalId = await insertJournalRow(t.ctx, owner.member.id, overrides);
  return { owner, journalId };
}

describe('POST /api/journals/:id/comments', () => {
  it('refuses visitors (401) and members who have not confirmed their e-mail (403)', async () => {
    const { journalId } = await ownerWithJournal();
    const anon = await visitor(t.app).post(path(journalId), { body: 'Lovely curd.' });
    expect(anon.status).toBe(401);
    const unverified = await signedIn(t.app, t.ctx, { verified: false });
    const res = await unverified.post(path(journalId), { body: 'Lovely curd.' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('EMAIL_NOT_VERIFIED');
    const list = await unverified.get(path(journalId)).expect(200);
    expect(list.body.canComment).toBe(false);
    expect(list.body.cannotCommentReason).toMatch(/Confirm your e-mail/);
  });

  it('validates the body and the reply target, with a message per field', async () => {
    const { journalId } = await ownerWithJournal();
    const reader = await signedIn(t.app, t.ctx);
    const empty = await reader.post(path(journalId), { body: '   ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.body).toBe('Write your comment.');
    const long = await reader.post(path(journalId), { body: 'x'.repeat(5001) });
    expect(long.body.error.fields.body).toMatch(/5000/);
    const other = await ownerWithJournal();
    const elsewhere = await insertCommentRow(t.ctx, other.journalId, other.owner.member.id);
    const wrongParent = await reader.post(path(journalId), { body: 'Yes!', parentId: elsewhere });
    expect(wrongParent.status).toBe(400);
    expect(wrongParent.body.error.fields.parentId).toBeTruthy();
    expect((await reader.post('/api/journals/abc/comments', { body: 'x' })).status).toBe(400);
  });

  it('answers 404 for a private journal or a draft of someone else, and refuses comments on a hidden one', async () => {
    const reader = await signedIn(t.app, t.ctx);
    const priv = await ownerWithJournal({ visibility: 'private' });
    expect((await reader.post(path(priv.journalId), { body: 'Hello' })).status).toBe(404);
    expect((await reader.get(path(priv.journalId))).status).toBe(404);
    const draft = await ownerWithJournal({ status: 'draft' });
    expect((await reader.get(path(draft.journalId))).status).toBe(404);
    const hidden = await ownerWithJournal({ hiddenAt: new Date() });
    expect((await reader.post(path(hidden.journalId), { body: 'Hello' })).status).toBe(404);
    const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
    const closed = await mod.post(path(hidden.journalId), { body: 'Hello' });
    expect(closed.status).toBe(403);
    expect(closed.body.error.code).toBe('COMMENTS_CLOSED');
  });

  it('posts sanitised Markdown without images, tells the owner in the app and by e-mail, and threads one level', async () => {
    const { owner, journalId } = await ownerWithJournal({ title: 'Harbour cheddar' });
    const reader = await signedIn(t.app, t.ctx);
    const res = await reader.post(path(journalId), {
      body: 'How long did you **cheddar**? ![pixel](https://example.test/p.gif) <img src=x onerror=alert(1)>',
    });
    expect(res.status).toBe(201);
    const c = res.body.comment;
    expect(c).toMatchObject({ state: 'visible', parentId: null, canEdit: true, canDelete: true });
    expect(c.author.handle).toBe(reader.member.handle);
    expect(c.bodyHtml).toContain('<strong>cheddar</strong>');
    // Raw HTML stays text, and Markdown images are not rendered at all.
    expect(c.bodyHtml).not.toMatch(/<img/i);
    expect(c.bodyHtml).toContain('&lt;img src=x onerror=alert(1)&gt;');
    expect(c.body).toContain('cheddar');

    const notices = await owner.get('/api/notifications').expect(200);
    expect(notices.body.unread).toBe(1);
    expect(notices.body.items[0]).toMatchObject({
      kind: 'comment',
      actor: { handle: reader.member.handle },
      journal: { id: journalId, title: 'Harbour cheddar' },
      commentId: c.id,
      link: `/journals/${journalId}#comment-${c.id}`,
      read: false,
    });
    const mail = await mailTo(owner.member.email, /commented on Harbour cheddar/);
    expect(mail?.text).toContain(`/journals/${journalId}#comment-${c.id}`);
    expect(mail?.html).not.toMatch(/<img/i);

    // A reply to a reply attaches to the top-level comment, and its author hears of it.
    const third = await signedIn(t.app, t.ctx);
    const reply = await owner.post(path(journalId), { body: 'Ninety minutes.', parentId: c.id });
    expect(reply.status).toBe(201);
    const deeper = await third.post(path(journalId), {
      body: 'Same here.',
      parentId: reply.body.comment.id,
    });
    expect(deeper.body.comment.parentId).toBe(c.id);
    const readerNotices = await reader.get('/api/notifications').expect(200);
    expect(readerNotices.body.items.map((n: { kind: string }) => n.kind)).toEqual([
      'reply',
      'reply',
    ]);

    const list = await visitor(t.app).get(path(journalId)).expect(200);
    expect(list.body.total).toBe(3);
    expect(list.body.items).toHaveLength(1);
    expect(list.body.items[0].replies.map((r: { id: number }) => r.id)).toEqual([
      reply.body.comment.id,
      deeper.body.comment.id,
    ]);
    // Nobody but the author receives the Markdown source, and visitors can do nothing.
    expect(list.body.items[0]).toMatchObject({ body: null, canEdit: false, canReport: false });
    expect(list.body.canComment).toBe(false);
  });

  it('sends no e-mail to an owner who turned comment e-mails off, and still notifies in the app', async () => {
    const { owner, journalId } = await ownerWithJournal({ title: 'Quiet tomme' });
    const off = await owner.patch('/api/auth/me', { notifyComments: false });
    expect(off.status).toBe(200);
    expect(off.body.member.notifyComments).toBe(false);
    const reader = await signedIn(t.app, t.ctx);
    expect((await reader.post(path(journalId), { body: 'Nice rind.' })).status).toBe(201);
    expect(await mailTo(owner.member.email, /commented on Quiet tomme/, 600)).toBeUndefined();
    expect((await owner.get('/api/notifications/count').expect(200)).body.unread).toBe(1);
  });

  it('holds to 10 comments per member in ten minutes (429 after)', async () => {
    const { journalId } = await ownerWithJournal();
    const chatty = await signedIn(t.app, t.ctx);
    for (let i = 0; i < 10; i++) {
      expect((await chatty.post(path(journalId), { body: `Point ${i}` })).status).toBe(201);
    }
    const limited = await chatty.post(path(journalId), { body: 'One more' });
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe('RATE_LIMITED');
    expect(Number(limited.headers['retry-after'])).toBeGreaterThan(0);
    // Another member is not affected.
    const other = await signedIn(t.app, t.ctx);
    expect((await other.post(path(journalId), { body: 'Me too' })).status).toBe(201);
  });
});

describe('PATCH /api/comments/:id', () => {
  it('lets only the author change a comment, and only for 30 minutes', async () => {
    const { owner, journalId } = await ownerWithJournal();
    const author = await signedIn(t.app, t.ctx);
    const posted = await author.post(path(journalId), { body: 'Firts thought' });
    const id = posted.body.comment.id as number;
    expect(posted.body.comment.editableUntil).toBeTruthy();

    expect((await visitor(t.app).patch(`/api/comments/${id}`, { body: 'x' })).status).toBe(401);
    const notMine = await owner.patch(`/api/comments/${id}`, { body: 'Rewritten by the owner' });
    expect(notMine.status).toBe(403);
    expect(notMine.body.error.code).toBe('NOT_YOUR_COMMENT');
    const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
    expect((await mod.patch(`/api/comments/${id}`, { body: 'Moderated' })).status).toBe(403);
    expect((await author.patch(`/api/comments/${id}`, { body: '' })).status).toBe(400);

    const fixed = await author.patch(`/api/comments/${id}`, { body: 'First thought' });
    expect(fixed.status).toBe(200);
    expect(fixed.body.comment.bodyHtml).toContain('First thought');
    expect(fixed.body.comment.editedAt).toBeTruthy();

    await t.ctx.database.db
      .update(comments)
      .set({ createdAt: new Date(Date.now() - 31 * 60_000) })
      .where(eq(comments.id, id));
    const late = await author.patch(`/api/comments/${id}`, { body: 'Too late' });
    expect(late.status).toBe(403);
    expect(late.body.error.code).toBe('EDIT_WINDOW_CLOSED');
    const list = await author.get(path(journalId)).expect(200);
    expect(list.body.items[0]).toMatchObject({
      canEdit: false,
      canDelete: true,
      editableUntil: null,
    });
    expect((await author.patch('/api/comments/999999999', { body: 'x' })).status).toBe(404);
  });

  it('never lets a hidden comment be changed, and hides it from others as if it did not exist', async () => {
    const { journalId } = await ownerWithJournal();
    const author = await signedIn(t.app, t.ctx);
    const id = await insertCommentRow(t.ctx, journalId, author.member.id, { hiddenAt: new Date() });
    const res = await author.patch(`/api/comments/${id}`, { body: 'Sneaky' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('COMMENT_HIDDEN');
    const other = await signedIn(t.app, t.ctx);
    expect((await other.patch(`/api/comments/${id}`, { body: 'x' })).status).toBe(404);
    expect((await other.delete(`/api/comments/${id}`)).status).toBe(404);
  });
});

describe('DELETE /api/comments/:id', () => {
  it('lets the author delete at any time and staff too (audited); replies keep a placeholder', async () => {
    const { owner, journalId } = await ownerWithJournal();
    const author = await signedIn(t.app, t.ctx);
    const first = await insertCommentRow(t.ctx, journalId, author.member.id, {
      createdAt: new Date(Date.now() - 5 * 86_400_000),
    });
    const reply = await insertCommentRow(t.ctx, journalId, owner.member.id, { parentId: first });
    expect((await visitor(t.app).delete(`/api/comments/${first}`)).status).toBe(401);
    const refused = await owner.delete(`/api/comments/${first}`);
    expect(refused.status).toBe(403);
    expect((await author.delete(`/api/comments/${first}`)).status).toBe(204);
    expect((await author.delete(`/api/comments/${first}`)).status).toBe(404);

    const list = await visitor(t.app).get(path(journalId)).expect(200);
    expect(list.body.total).toBe(1);
    expect(list.body.items[0]).toMatchObject({
      id: first,
      state: 'removed',
      author: null,
      bodyHtml: '',
    });
    expect(list.body.items[0].replies[0].id).toBe(reply);

    const admin = await signedIn(t.app, t.ctx, { role: 'admin' });
    expect((await admin.delete(`/api/comments/${reply}`)).status).toBe(204);
    const empty = await visitor(t.app).get(path(journalId)).expect(200);
    expect(empty.body.items).toEqual([]);
    expect(empty.body.total).toBe(0);
    const audit = await admin.get(`/api/admin/audit?actor=${admin.member.handle}`).expect(200);
    expect(audit.body.items[0]).toMatchObject({
      action: 'comment-deleted',
      targetType: 'comment',
      targetId: reply,
      targetUser: { handle: owner.member.handle },
    });
  });
});

describe("holding new members' first comments", () => {
  it('holds them for a moderator when the setting is on, and shows them only to author and staff until approved', async () => {
    const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
    const member = await signedIn(t.app, t.ctx);
    const { owner, journalId } = await ownerWithJournal({ title: 'Market chèvre' });
    const seasoned = await signedIn(t.app, t.ctx);
    await makeSeasoned(t.ctx, seasoned.member.id);

    expect((await member.put('/api/moderation/settings', { holdFirstComments: true })).status).toBe(
      403,
    );
    expect((await mod.put('/api/moderation/settings', { holdFirstComments: 'yes' })).status).toBe(
      400,
    );
    const on = await mod.put('/api/moderation/settings', { holdFirstComments: true });
    let heldId: number;
    let rejectedId: number;
    try {
      expect(on.body.settings).toMatchObject({
        holdFirstComments: true,
        updatedBy: mod.member.handle,
      });
      const held = await member.post(path(journalId), { body: 'My very first comment' });
      expect(held.status).toBe(202);
      expect(held.body).toMatchObject({ held: true, comment: { state: 'pending' } });
      heldId = held.body.comment.id;
      rejectedId = (await member.post(path(journalId), { body: 'Buy cheap rennet here' })).body
        .comment.id;
      // Staff and members with visible comments are not held.
      expect((await seasoned.post(path(journalId), { body: 'Welcome!' })).status).toBe(201);
      expect((await mod.post(path(journalId), { body: 'Hello from the mods' })).status).toBe(201);
    } finally {
      await mod.put('/api/moderation/settings', { holdFirstComments: false });
    }

    const states = async (who: typeof member | ReturnType<typeof visitor>) =>
      (await who.get(path(journalId)).expect(200)).body.items.map(
        (c: { id: number; state: string }) => [c.id, c.state],
      );
    expect(await states(visitor(t.app))).not.toContainEqual([heldId, 'pending']);
    expect((await states(owner)).map((s: unknown[]) => s[0])).not.toContain(heldId);
    expect(await states(member)).toContainEqual([heldId, 'pending']);
    expect(await states(mod)).toContainEqual([heldId, 'pending']);
    // The owner hears nothing of held comments.
    const ownerNotices = (await owner.get('/api/notifications').expect(200)).body.items;
    expect(ownerNotices.map((n: { commentId: number }) => n.commentId)).not.toContain(heldId);

    expect((await member.get('/api/moderation/comments')).status).toBe(403);
    const queue = await mod.get('/api/moderation/comments').expect(200);
    const queued = queue.body.items.map((c: { id: number }) => c.id);
    expect(queued).toEqual(expect.arrayContaining([heldId, rejectedId]));

    expect(
      (await mod.post(`/api/moderation/comments/${heldId}/actions`, { action: 'publish' })).status,
    ).toBe(400);
    expect(
      (await mod.post(`/api/moderation/comments/${heldId}/actions`, { action: 'approve' })).status,
    ).toBe(204);
    expect(
      (
        await mod.post(`/api/moderation/comments/${rejectedId}/actions`, {
          action: 'reject',
          note: 'No advertising, please.',
        })
      ).status,
    ).toBe(204);
    expect(
      (await mod.post(`/api/moderation/comments/${heldId}/actions`, { action: 'approve' })).status,
    ).toBe(409);

    expect(await states(visitor(t.app))).toContainEqual([heldId, 'visible']);
    expect((await states(visitor(t.app))).map((s: unknown[]) => s[0])).not.toContain(rejectedId);
    expect(await states(member)).toContainEqual([rejectedId, 'hidden']);
    const notices = (await owner.get('/api/notifications').expect(200)).body.items;
    expect(notices.map((n: { commentId: number }) => n.commentId)).toContain(heldId);
    const memberNotices = (await member.get('/api/notifications').expect(200)).body.items;
    expect(memberNotices.map((n: { kind: string; text: string }) => [n.kind, n.text])).toEqual(
      expect.arrayContaining([
        ['comment-approved', ''],
        ['hidden', 'No advertising, please.'],
      ]),
    );

    const admin = await signedIn(t.app, t.ctx, { role: 'admin' });
    const audit = await admin.get(`/api/admin/audit?actor=${mod.member.handle}`).expect(200);
    expect(audit.body.items.map((e: { action: string }) => e.action)).toEqual([
      'comment-rejected',
      'comment-approved',
      'setting-changed',
      'setting-changed',
    ]);
  });
});

describe('GET /api/journals/:id/comments', () => {
  it('pages the top-level threads and validates the page', async () => {
    const { owner, journalId } = await ownerWithJournal();
    for (let i = 0; i < 5; i++) {
      await insertCommentRow(t.ctx, journalId, owner.member.id, {
        createdAt: new Date(Date.now() - (10 - i) * 60_000),
        body: `Thread ${i}`,
      });
    }
    const page2 = await visitor(t.app)
      .get(`${path(journalId)}?page=2&pageSize=2`)
      .expect(200);
    expect(page2.body).toMatchObject({ threads: 5, total: 5, page: 2, pageSize: 2 });
    expect(page2.body.items.map((c: { bodyHtml: string }) => c.bodyHtml)).toEqual([
      '<p>Thread 2</p>\n',
      '<p>Thread 3</p>\n',
    ]);
    expect((await visitor(t.app).get(`${path(journalId)}?pageSize=500`)).status).toBe(400);
  });

  it('no longer shows comments of a member whose account was deleted', async () => {
    const { journalId } = await ownerWithJournal();
    const leaving = await signedIn(t.app, t.ctx);
    await insertCommentRow(t.ctx, journalId, leaving.member.id);
    await t.ctx.database.db.delete(users).where(eq(users.id, leaving.member.id));
    expect((await visitor(t.app).get(path(journalId)).expect(200)).body.items).toEqual([]);
  });
});

import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { users } from '../../server/db/schema';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { createMember, signedIn } from '../support/factories';
import { insertCommentRow, insertPhotoRow, insertTastingRow } from '../support/community-factory';
import { insertJournalRow } from '../support/journal-rows';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

type Agent = Awaited<ReturnType<typeof signedIn>>;

/** A member's comment on someone's journal, reported by a third member; resolves with ids. */
async function reportedComment(reason = 'spam') {
  const owner = await createMember(t.ctx);
  const author = await signedIn(t.app, t.ctx);
  const journalId = await insertJournalRow(t.ctx, owner.id, { title: 'Washed-rind trial' });
  const commentId = await insertCommentRow(t.ctx, journalId, author.member.id, {
    body: 'Visit my shop for cheap cultures',
  });
  const reporter = await signedIn(t.app, t.ctx);
  const res = await reporter.post('/api/reports', {
    targetType: 'comment',
    targetId: commentId,
    reason,
    details: 'Advertising',
  });
  expect(res.status).toBe(201);
  return { owner, author, journalId, commentId, reporter, reportId: res.body.report.id as number };
}

const act = (who: Agent, reportId: number, action: string, note = '') =>
  who.post(`/api/moderation/reports/${reportId}/actions`, { action, note });

describe('POST /api/reports', () => {
  it('refuses visitors (401) and unverified members (403), and validates the report', async () => {
    const body = { targetType: 'journal', targetId: 1, reason: 'spam' };
    expect((await visitor(t.app).post('/api/reports', body)).status).toBe(401);
    const unverified = await signedIn(t.app, t.ctx, { verified: false });
    expect((await unverified.post('/api/reports', body)).status).toBe(403);
    const member = await signedIn(t.app, t.ctx);
    const bad = await member.post('/api/reports', {
      targetType: 'recipe',
      targetId: -1,
      reason: 'meh',
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['reason', 'targetId', 'targetType']);
  });

  it('takes reports of journals, photos, tastings and comments the member can see, never their own', async () => {
    const owner = await signedIn(t.app, t.ctx);
    const member = await signedIn(t.app, t.ctx);
    const journalId = await insertJournalRow(t.ctx, owner.member.id);
    const photoId = await insertPhotoRow(t.ctx, journalId);
    const tastingId = await insertTastingRow(t.ctx, journalId, owner.member.id, 7);
    const commentId = await insertCommentRow(t.ctx, journalId, owner.member.id);
    for (const [targetType, targetId] of [
      ['journal', journalId],
      ['photo', photoId],
      ['tasting', tastingId],
      ['comment', commentId],
    ] as const) {
      const res = await member.post('/api/reports', { targetType, targetId, reason: 'other' });
      expect(res.status).toBe(201);
    }
    // The same report again while the first is open is the first one.
    const again = await member.post('/api/reports', {
      targetType: 'journal',
      targetId: journalId,
      reason: 'spam',
    });
    expect(again.status).toBe(200);
    const own = await owner.post('/api/reports', {
      targetType: 'journal',
      targetId: journalId,
      reason: 'spam',
    });
    expect(own.status).toBe(400);
    expect(own.body.error.code).toBe('CANNOT_REPORT_OWN');
    const privateJournal = await insertJournalRow(t.ctx, owner.member.id, {
      visibility: 'private',
    });
    const hiddenComment = await insertCommentRow(t.ctx, journalId, owner.member.id, {
      hiddenAt: new Date(),
    });
    for (const [targetType, targetId] of [
      ['journal', privateJournal],
      ['comment', hiddenComment],
      ['photo', 999_999_999],
    ] as const) {
      const res = await member.post('/api/reports', { targetType, targetId, reason: 'spam' });
      expect(res.status).toBe(404);
    }
  });

  it('holds to 10 reports per member an hour (429 after)', async () => {
    const owner = await createMember(t.ctx);
    const member = await signedIn(t.app, t.ctx);
    const journalId = await insertJournalRow(t.ctx, owner.id);
    for (let i = 0; i < 11; i++) {
      const commentId = await insertCommentRow(t.ctx, journalId, owner.id);
      const res = await member.post('/api/reports', {
        targetType: 'comment',
        targetId: commentId,
        reason: 'spam',
      });
      expect(res.status).toBe(i < 10 ? 201 : 429);
    }
  });
});

describe('who reaches the moderation routes', () => {
  it('answers 401 to visitors and 403 to members on every moderation and audit route', async () => {
    const member = await signedIn(t.app, t.ctx);
    const anon = visitor(t.app);
    const moderator = await signedIn(t.app, t.ctx, { role: 'moderator' });
    const routes: [string, string, object?][] = [
      ['get', '/api/moderation/reports'],
      ['get', '/api/moderation/reports/1'],
      ['post', '/api/moderation/reports/1/actions', { action: 'dismiss' }],
      ['get', '/api/moderation/comments'],
      ['post', '/api/moderation/comments/1/actions', { action: 'approve' }],
      ['get', '/api/moderation/settings'],
      ['put', '/api/moderation/settings', { holdFirstComments: false }],
      ['get', '/api/admin/audit'],
    ];
    for (const [method, path, body] of routes) {
      const call = (who: typeof member | typeof anon) =>
        method === 'get'
          ? who.get(path)
          : (who as typeof member)[method as 'post' | 'put'](path, body);
      expect((await call(anon)).status, `${method} ${path} visitor`).toBe(401);
      const refused = await call(member);
      expect(refused.status, `${method} ${path} member`).toBe(403);
      expect(refused.body.error.code).toBe('ROLE_REQUIRED');
    }
    // The audit log is for admins only.
    expect((await moderator.get('/api/admin/audit')).status).toBe(403);
    expect((await moderator.get('/api/moderation/reports')).status).toBe(200);
  });
});

describe('the moderation queue', () => {
  it('shows the reported item, its reporter, the other reports and the history, and validates queries', async () => {
    const { commentId, reporter, reportId, author } = await reportedComment();
    const second = await signedIn(t.app, t.ctx);
    await second.post('/api/reports', {
      targetType: 'comment',
      targetId: commentId,
      reason: 'abusive',
    });
    const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
    expect((await mod.get('/api/moderation/reports?status=maybe')).status).toBe(400);
    const one = await mod.get(`/api/moderation/reports/${reportId}`).expect(200);
    expect(one.body.report).toMatchObject({
      id: reportId,
      status: 'open',
      reason: 'spam',
      details: 'Advertising',
      reporter: { handle: reporter.member.handle },
      item: {
        type: 'comment',
        id: commentId,
        exists: true,
        hidden: false,
        author: { handle: author.member.handle, role: 'member', suspended: false },
      },
      allowed: { dismiss: true, hide: true, restore: false, suspend: false },
    });
    expect(one.body.report.item.bodyHtml).toContain('cheap cultures');
    expect(one.body.report.reports.map((r: { reason: string }) => r.reason)).toEqual([
      'abusive',
      'spam',
    ]);
    const open = await mod.get('/api/moderation/reports?status=open&pageSize=50').expect(200);
    expect(open.body.items.map((r: { id: number }) => r.id)).toContain(reportId);
    expect((await mod.get('/api/moderation/reports/999999999')).status).toBe(404);
  });

  it('lets a moderator hide and restore, with a note to the author, and closes every open report of the item', async () => {
    const { author, journalId, commentId, reportId } = await reportedComment();
    const second = await signedIn(t.app, t.ctx);
    const other = await second.post('/api/reports', {
      targetType: 'comment',
      targetId: commentId,
      reason: 'abusive',
    });
    const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
    expect((await act(mod, reportId, 'erase')).status).toBe(400);
    expect((await act(mod, reportId, 'hide', 'x'.repeat(1001))).status).toBe(400);
    const hidden = await act(mod, reportId, 'hide', 'No advertising in comments.');
    expect(hidden.status).toBe(200);
    expect(hidden.body.report).toMatchObject({
      status: 'actioned',
      item: { hidden: true },
      allowed: { dismiss: false, hide: false, restore: true },
    });
    expect(hidden.body.report.history[0]).toMatchObject({
      action: 'item-hidden',
      actor: { handle: mod.member.handle },
      note: 'No advertising in comments.',
      reportId,
    });
    const sibling = await mod.get(`/api/moderation/reports/${other.body.report.id}`).expect(200);
    expect(sibling.body.report.status).toBe('actioned');
    // Hiding twice is refused.
    expect((await act(mod, reportId, 'hide')).status).toBe(409);

    const notices = (await author.get('/api/notifications').expect(200)).body.items;
    expect(notices[0]).toMatchObject({
      kind: 'hidden',
      targetType: 'comment',
      targetId: commentId,
      text: 'No advertising in comments.',
      link: `/journals/${journalId}#comment-${commentId}`,
    });
    const restored = await act(mod, reportId, 'restore', 'On second reading it is fine.');
    expect(restored.body.report.item.hidden).toBe(false);
    const again = (await author.get('/api/notifications').expect(200)).body.items;
    expect(again[0]).toMatchObject({ kind: 'restored', text: 'On second reading it is fine.' });
  });

  it('lets a moderator dismiss, but not twice, and not suspend (admins only)', async () => {
    const { reportId } = await reportedComment();
    const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
    const suspend = await act(mod, reportId, 'suspend');
    expect(suspend.status).toBe(403);
    expect(suspend.body.error.code).toBe('ADMIN_ONLY');
    const dismissed = await act(mod, reportId, 'dismiss', 'Not spam: a real shop link asked for.');
    expect(dismissed.body.report.status).toBe('dismissed');
    expect((await act(mod, reportId, 'dismiss')).status).toBe(409);
  });

  it('never lets staff decide a report about their own contribution', async () => {
    const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
    const owner = await createMember(t.ctx);
    const journalId = await insertJournalRow(t.ctx, owner.id);
    const commentId = await insertCommentRow(t.ctx, journalId, mod.member.id);
    const reporter = await signedIn(t.app, t.ctx);
    const { body } = await reporter.post('/api/reports', {
      targetType: 'comment',
      targetId: commentId,
      reason: 'abusive',
    });
    const view = await mod.get(`/api/moderation/reports/${body.report.id}`).expect(200);
    expect(view.body.report.allowed).toEqual({
      dismiss: false,
      hide: false,
      restore: false,
      suspend: false,
    });
    const refused = await act(mod, body.report.id, 'dismiss');
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('OWN_CONTRIBUTION');
  });

  it('lets an admin suspend a member: account disabled, sessions ended, e-mail sent; never staff', async () => {
    const { author, reportId } = await reportedComment();
    const admin = await signedIn(t.app, t.ctx, { role: 'admin' });
    expect((await author.get('/api/auth/me')).status).toBe(200);
    const res = await act(admin, reportId, 'suspend', 'Repeated advertising.');
    expect(res.status).toBe(200);
    expect(res.body.report.item.author.suspended).toBe(true);
    expect(res.body.report.history[0]).toMatchObject({
      action: 'member-suspended',
      targetType: 'member',
      targetUser: { handle: author.member.handle },
    });
    const [row] = await t.ctx.database.db
      .select()
      .from(users)
      .where(eq(users.id, author.member.id));
    expect(row.disabledAt).not.toBeNull();
    expect((await author.get('/api/auth/me')).status).toBe(401);
    let mail;
    for (let i = 0; i < 40 && !mail; i++) {
      mail = t.ctx.mailbox?.list().find((m) => m.to.includes(author.member.email));
      if (!mail) await new Promise((r) => setTimeout(r, 50));
    }
    expect(mail?.subject).toBe('Your Rindwise account is suspended');
    expect(mail?.text).toContain('Repeated advertising.');
    expect((await act(admin, reportId, 'suspend')).status).toBe(409);

    // Staff are not suspended from the queue: their role changes first.
    const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
    const owner = await createMember(t.ctx);
    const journalId = await insertJournalRow(t.ctx, owner.id);
    const modComment = await insertCommentRow(t.ctx, journalId, mod.member.id);
    const reporter = await signedIn(t.app, t.ctx);
    const rep = await reporter.post('/api/reports', {
      targetType: 'comment',
      targetId: modComment,
      reason: 'abusive',
    });
    const refused = await act(admin, rep.body.report.id, 'suspend');
    expect(refused.status).toBe(409);
  });
});

describe('GET /api/admin/audit', () => {
  it('records every action with its actor, target, note and report, newest first', async () => {
    const { reportId, commentId, author } = await reportedComment();
    const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
    const admin = await signedIn(t.app, t.ctx, { role: 'admin' });
    await act(mod, reportId, 'hide', 'Spam.').then((r) => expect(r.status).toBe(200));
    await act(mod, reportId, 'restore', 'Appeal upheld.').then((r) => expect(r.status).toBe(200));
    await act(admin, reportId, 'suspend', 'Third strike.').then((r) => expect(r.status).toBe(200));
    const member = await createMember(t.ctx);
    expect((await admin.patch(`/api/admin/users/${member.id}`, { role: 'moderator' })).status).toBe(
      200,
    );
    expect(
      (await admin.patch(`/api/admin/users/${author.member.id}`, { disabled: false })).status,
    ).toBe(200);

    expect((await admin.get('/api/admin/audit?pageSize=1000')).status).toBe(400);
    const modLog = await admin.get(`/api/admin/audit?actor=@${mod.member.handle}`).expect(200);
    expect(
      modLog.body.items.map((e: { action: string; note: string }) => [e.action, e.note]),
    ).toEqual([
      ['item-restored', 'Appeal upheld.'],
      ['item-hidden', 'Spam.'],
    ]);
    expect(modLog.body.items[1]).toMatchObject({
      targetType: 'comment',
      targetId: commentId,
      reportId,
      targetUser: { handle: author.member.handle },
    });
    const adminLog = await admin.get(`/api/admin/audit?actor=${admin.member.handle}`).expect(200);
    expect(adminLog.body.items.map((e: { action: string }) => e.action)).toEqual([
      'member-enabled',
      'role-changed',
      'member-suspended',
    ]);
    expect(adminLog.body.items[1].summary).toBe(`@${member.handle}: member → moderator`);
  });
});

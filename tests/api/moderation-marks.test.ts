import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuditEntryDto, CommentDto } from '../../shared/types/community';
import type { JournalDto, JournalSummaryDto } from '../../shared/types/journal';
import type { TastingDto } from '../../shared/types/tasting';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { createMember, signedIn } from '../support/factories';
import { insertCommentRow, insertTastingRow } from '../support/community-factory';
import { insertJournalRow } from '../support/journal-rows';

// What an author sees of a moderator's hide, and the audit of staff deletes.
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

type Agent = Awaited<ReturnType<typeof signedIn>>;

async function reportAndHide(
  reporter: Agent,
  mod: Agent,
  targetType: string,
  targetId: number,
  note: string,
) {
  const filed = await reporter.post('/api/reports', { targetType, targetId, reason: 'other' });
  expect(filed.status).toBe(201);
  const acted = await mod.post(`/api/moderation/reports/${filed.body.report.id}/actions`, {
    action: 'hide',
    note,
  });
  expect(acted.status).toBe(200);
}

async function auditOf(admin: Agent, actorHandle: string): Promise<AuditEntryDto[]> {
  const res = await admin.get(`/api/admin/audit?actor=${actorHandle}`).expect(200);
  return res.body.items;
}

describe('the "hidden by a moderator" mark', () => {
  it('reaches the maker on the journal and in My journals, with the note; never anyone else', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const reporter = await signedIn(t.app, t.ctx);
    const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
    const journalId = await insertJournalRow(t.ctx, maker.member.id, { title: 'Smoked trial' });
    const before = (await maker.get(`/api/journals/${journalId}`)).body as JournalDto;
    expect(before.hidden).toBeNull();

    await reportAndHide(reporter, mod, 'journal', journalId, 'The notes advertise a shop.');

    const mine = (await maker.get(`/api/journals/${journalId}`).expect(200)).body as JournalDto;
    expect(mine.hidden).toMatchObject({ reason: 'The notes advertise a shop.' });
    expect(Date.parse(mine.hidden!.hiddenAt)).toBeGreaterThan(0);
    const list = await maker.get('/api/journals?mine=true&pageSize=50').expect(200);
    const card = (list.body.items as JournalSummaryDto[]).find((j) => j.id === journalId)!;
    expect(card.hidden).toMatchObject({ reason: 'The notes advertise a shop.' });

    // Staff see the same mark; readers and visitors do not see the journal at all.
    const staffView = (await mod.get(`/api/journals/${journalId}`).expect(200)).body as JournalDto;
    expect(staffView.hidden?.reason).toBe('The notes advertise a shop.');
    expect((await reporter.get(`/api/journals/${journalId}`)).status).toBe(404);
    expect((await visitor(t.app).get(`/api/journals/${journalId}`)).status).toBe(404);
  });

  it('reaches the taster on a hidden tasting and the author on a hidden comment', async () => {
    const owner = await createMember(t.ctx);
    const taster = await signedIn(t.app, t.ctx);
    const reporter = await signedIn(t.app, t.ctx);
    const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
    const journalId = await insertJournalRow(t.ctx, owner.id, { title: 'Tomme at four months' });
    const tastingId = await insertTastingRow(t.ctx, journalId, taster.member.id, 7);
    const commentId = await insertCommentRow(t.ctx, journalId, taster.member.id, {
      body: 'Off-topic rant',
    });
    await reportAndHide(reporter, mod, 'tasting', tastingId, 'Scores copied from elsewhere.');
    await reportAndHide(reporter, mod, 'comment', commentId, '');

    const tastings = (await taster.get(`/api/journals/${journalId}/tastings`).expect(200)).body
      .tastings as TastingDto[];
    expect(tastings.find((x) => x.id === tastingId)?.hidden).toMatchObject({
      reason: 'Scores copied from elsewhere.',
    });
    const comments = (await taster.get(`/api/journals/${journalId}/comments`).expect(200)).body
      .items as CommentDto[];
    const comment = comments.find((c) => c.id === commentId)!;
    expect(comment.state).toBe('hidden');
    expect(comment.hidden).toMatchObject({ reason: '' });

    // The reporter never receives the hidden items, so no mark either.
    const theirs = (await reporter.get(`/api/journals/${journalId}/tastings`).expect(200)).body
      .tastings as TastingDto[];
    expect(theirs.some((x) => x.id === tastingId)).toBe(false);
  });
});

describe('staff deletes in the audit log', () => {
  it('refuses bad input (400) and strangers (401, 403) and logs nothing for them', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
    const admin = await signedIn(t.app, t.ctx, { role: 'admin' });
    const journalId = await insertJournalRow(t.ctx, maker.member.id);
    expect(
      (await visitor(t.app).delete(`/api/journals/${journalId}`, { reason: 'x' })).status,
    ).toBe(401);
    const other = await signedIn(t.app, t.ctx);
    expect((await other.delete(`/api/journals/${journalId}`, { reason: 'x' })).status).toBe(403);
    const tooLong = await mod.delete(`/api/journals/${journalId}`, { reason: 'x'.repeat(1001) });
    expect(tooLong.status).toBe(400);
    expect(tooLong.body.error.fields.reason).toMatch(/1000/);
    expect((await maker.get(`/api/journals/${journalId}`)).status).toBe(200);
    expect(await auditOf(admin, mod.member.handle)).toEqual([]);
  });

  it("records a moderator's delete of a journal with who, what, when and the reason", async () => {
    const maker = await signedIn(t.app, t.ctx);
    const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
    const admin = await signedIn(t.app, t.ctx, { role: 'admin' });
    const journalId = await insertJournalRow(t.ctx, maker.member.id, { title: 'Copied recipe' });
    const res = await mod.delete(`/api/journals/${journalId}`, {
      reason: '  Copied word for word from a book.  ',
    });
    expect(res.status).toBe(204);
    expect((await maker.get(`/api/journals/${journalId}`)).status).toBe(404);
    const [entry] = await auditOf(admin, mod.member.handle);
    expect(entry).toMatchObject({
      action: 'journal-deleted',
      actor: { id: mod.member.id, handle: mod.member.handle },
      targetType: 'journal',
      targetId: journalId,
      targetUser: { id: maker.member.id, handle: maker.member.handle },
      note: 'Copied word for word from a book.',
    });
    expect(entry.summary).toContain('Copied recipe');
    expect(Date.now() - Date.parse(entry.createdAt)).toBeLessThan(60_000);
  });

  it('does not log a maker deleting their own journal, and logs a delete without a reason', async () => {
    const maker = await signedIn(t.app, t.ctx, { role: 'moderator' });
    const admin = await signedIn(t.app, t.ctx, { role: 'admin' });
    const own = await insertJournalRow(t.ctx, maker.member.id);
    expect((await maker.delete(`/api/journals/${own}`)).status).toBe(204);
    expect(await auditOf(admin, maker.member.handle)).toEqual([]);
    const other = await createMember(t.ctx);
    const theirs = await insertJournalRow(t.ctx, other.id);
    expect((await admin.delete(`/api/journals/${theirs}`)).status).toBe(204);
    const [entry] = await auditOf(admin, admin.member.handle);
    expect(entry).toMatchObject({ action: 'journal-deleted', targetId: theirs, note: '' });
  });

  it("records staff deletes of a member's tasting and comment with the reason", async () => {
    const owner = await createMember(t.ctx);
    const taster = await signedIn(t.app, t.ctx);
    const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
    const admin = await signedIn(t.app, t.ctx, { role: 'admin' });
    const journalId = await insertJournalRow(t.ctx, owner.id, { title: 'Blue, six weeks' });
    const tastingId = await insertTastingRow(t.ctx, journalId, taster.member.id, 9);
    const commentId = await insertCommentRow(t.ctx, journalId, taster.member.id);
    expect(
      (await mod.delete(`/api/tastings/${tastingId}`, { reason: 'x'.repeat(1001) })).status,
    ).toBe(400);
    expect((await mod.delete(`/api/tastings/${tastingId}`, { reason: 'Duplicate.' })).status).toBe(
      204,
    );
    expect((await mod.delete(`/api/comments/${commentId}`, { reason: 'Abusive.' })).status).toBe(
      204,
    );
    const entries = await auditOf(admin, mod.member.handle);
    expect(entries.map((e) => [e.action, e.targetId, e.note])).toEqual([
      ['comment-deleted', commentId, 'Abusive.'],
      ['tasting-deleted', tastingId, 'Duplicate.'],
    ]);
    expect(entries[1].targetUser?.handle).toBe(taster.member.handle);
    expect(entries[1].summary).toContain('Blue, six weeks');
    // The taster deleting their own tasting is not a moderation action.
    const mine = await insertTastingRow(t.ctx, journalId, taster.member.id, 6);
    expect((await taster.delete(`/api/tastings/${mine}`)).status).toBe(204);
    expect(await auditOf(admin, taster.member.handle)).toEqual([]);
  });
});

import { eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { journalReminders } from '../../server/db/schema/tastings';
import { LIMITS } from '../../server/lib/rate-limit';
import { runReminderPass } from '../../server/services/reminders.service';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { createMember, signedIn } from '../support/factories';
import { HttpVisitor, listen, type Listening } from '../support/http';
import { publicJournalDocument } from '../support/journal-factory';
import { daysAgo, insertJournalRow } from '../support/journal-rows';
import { ownDatabase, type OwnDatabase } from '../support/private-db';

// Two app servers (two contexts: two pools, two session stores, two limiters, two mailers)
// on two ports over real HTTP, against one database of this file's own, so the reminder
// passes of other test files cannot take our rows. Both mailers send to A's SMTP fake.
let database: OwnDatabase;
let a: TestApp;
let b: TestApp;
let serverA: Listening;
let serverB: Listening;

beforeAll(async () => {
  database = await ownDatabase('rindwise_multi');
  a = await createTestApp({ DATABASE_URL: database.url });
  b = await createTestApp({
    DATABASE_URL: database.url,
    SMTP_URL: `smtp://127.0.0.1:${a.ctx.mailbox!.port}`,
  });
  serverA = await listen(a.app);
  serverB = await listen(b.app);
}, 90_000);

afterAll(async () => {
  await serverA?.close();
  await serverB?.close();
  await b?.close();
  await a?.close();
  await database?.stop();
}, 60_000);

describe('two app servers on one database', () => {
  it('accept on B a session made on A, and end it everywhere at sign-out', async () => {
    expect(a.ctx.mailbox).not.toBeNull();
    expect(b.ctx.mailbox).toBeNull();
    const member = await createMember(a.ctx);
    const v = new HttpVisitor();
    const signIn = await v.post(serverA.url, '/api/auth/signin', {
      email: member.email,
      password: member.password,
    });
    expect(signIn.status).toBe(200);
    v.resetCsrf();

    const me = await v.get(serverB.url, '/api/auth/me');
    expect(me.status).toBe(200);
    expect((me.body as { member: { handle: string } }).member.handle).toBe(member.handle);
    // The CSRF token kept in the session on A is good for a write on B.
    v.useCsrf((signIn.body as { csrfToken: string }).csrfToken);
    const signOut = await v.post(serverB.url, '/api/auth/signout');
    expect(signOut.status).toBe(204);
    expect((await v.get(serverA.url, '/api/auth/me')).status).toBe(401);
  });

  it('share rate limits: the attempts used up on A count on B', async () => {
    const member = await createMember(a.ctx);
    const attempts = LIMITS.signInAccount.points;
    for (let i = 0; i < attempts; i++) {
      // A new address each time, so only the per-account limit is in play.
      const res = await new HttpVisitor().post(serverA.url, '/api/auth/signin', {
        email: member.email,
        password: 'not-the-password-at-all',
      });
      expect(res.status).toBe(401);
    }
    const onB = await new HttpVisitor().post(serverB.url, '/api/auth/signin', {
      email: member.email,
      password: member.password,
    });
    expect(onB.status).toBe(429);
    expect(Number(onB.headers.get('retry-after'))).toBeGreaterThan(0);
    // And the other way round, for the right password too: still blocked on A.
    const onA = await new HttpVisitor().post(serverA.url, '/api/auth/signin', {
      email: member.email,
      password: member.password,
    });
    expect(onA.status).toBe(429);
  });

  it("send each wheel's reminder exactly once when both run the reminder pass at once", async () => {
    const makers = await Promise.all([0, 1, 2].map(() => createMember(a.ctx)));
    const titles: string[] = [];
    const ids: number[] = [];
    // More wheels than one claim batch (50), so the two passes really contend.
    for (let i = 0; i < 70; i++) {
      const maker = makers[i % makers.length];
      const title = `Contended wheel ${i} ${maker.handle}`;
      titles.push(title);
      ids.push(
        await insertJournalRow(a.ctx, maker.id, {
          title,
          makeDate: daysAgo(100 + (i % 5)),
          agingTargetDays: 90,
        }),
      );
    }
    a.ctx.mailbox!.clear();
    const rounds = await Promise.all([
      runReminderPass(a.ctx),
      runReminderPass(b.ctx),
      runReminderPass(a.ctx),
      runReminderPass(b.ctx),
    ]);
    // A later pass on either server finds nothing left to send.
    const again = await Promise.all([runReminderPass(a.ctx), runReminderPass(b.ctx)]);
    expect(again.map((r) => r.sent)).toEqual([0, 0]);

    const mails = a.ctx.mailbox!.list();
    for (const title of titles) {
      expect(mails.filter((m) => m.subject.includes(title)).length, title).toBe(1);
    }
    expect(rounds.reduce((sum, r) => sum + r.sent, 0)).toBe(titles.length);
    expect(rounds.every((r) => r.failed === 0)).toBe(true);
    const rows = await a.ctx.database.db
      .select({ sentAt: journalReminders.sentAt })
      .from(journalReminders)
      .where(inArray(journalReminders.journalId, ids));
    expect(rows).toHaveLength(titles.length);
    expect(rows.every((r) => r.sentAt !== null)).toBe(true);
    // The unique key kept the queue itself single, whichever server queued first.
    const perJournal = await a.ctx.database.db
      .select({ id: journalReminders.id })
      .from(journalReminders)
      .where(eq(journalReminders.journalId, ids[0]));
    expect(perJournal).toHaveLength(1);
  });
});

describe('two app servers with the read cache on', () => {
  let c: TestApp;
  let d: TestApp;
  beforeAll(async () => {
    const env = { DATABASE_URL: database.url, READ_CACHE_SECONDS: '60', READ_CACHE_SYNC_MS: '200' };
    c = await createTestApp(env);
    d = await createTestApp(env);
  });
  afterAll(async () => {
    await c?.close();
    await d?.close();
  });

  it('drop their cached answers soon after a write served by the other', async () => {
    const maker = await signedIn(c.app, c.ctx);
    const word = `epochtest${maker.member.id}x`;
    const url = `/api/journals?q=${word}`;
    const created = await maker.post(
      '/api/journals',
      publicJournalDocument({ title: `The ${word} wheel` }),
    );
    expect(created.status).toBe(201);
    // D has seen C's write; from here D keeps what it reads for a minute.
    await d.ctx.readCacheSync!.check();
    expect((await visitor(d.app).get(url).expect(200)).body.total).toBe(1);

    // A row written behind both servers' backs is not seen by D: its answer is cached.
    await insertJournalRow(d.ctx, maker.member.id, { title: `A quiet ${word} wheel` });
    await d.ctx.readCacheSync!.check();
    expect((await visitor(d.app).get(url).expect(200)).body.total).toBe(1);

    // The maker deletes the first journal through C: D forgets its cached answer by itself
    // within a few of its checks (every 200 ms here), without a write of its own.
    expect((await maker.delete(`/api/journals/${created.body.id}`)).status).toBe(204);
    await vi.waitFor(
      async () => {
        const after = (await visitor(d.app).get(url).expect(200)).body;
        expect(after.items.map((i: { title: string }) => i.title)).toEqual([
          `A quiet ${word} wheel`,
        ]);
      },
      { timeout: 10_000, interval: 100 },
    );
  });
});

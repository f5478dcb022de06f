import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { journals, users } from '../../server/db/schema';
import { journalReminders } from '../../server/db/schema/tastings';
import { runReminderPass } from '../../server/services/reminders.service';
import { dayInWords } from '../../shared/trade/time';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { signedIn } from '../support/factories';
import { daysAgo, insertJournalRow } from '../support/journal-rows';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

const mailsAbout = (title: string) =>
  (t.ctx.mailbox?.list() ?? []).filter((m) => m.subject.includes(title));

describe('GET /api/cave', () => {
  it('is for signed-in members only', async () => {
    expect((await visitor(t.app).get('/api/cave')).status).toBe(401);
  });

  it("lists the member's unopened wheels with age, days left, ready date and progress", async () => {
    const maker = await signedIn(t.app, t.ctx);
    const aging = await insertJournalRow(t.ctx, maker.member.id, {
      makeDate: daysAgo(30),
      agingTargetDays: 90,
      agingTempC: 11,
      title: 'Aging wheel',
    });
    await insertJournalRow(t.ctx, maker.member.id, {
      wheelStatus: 'opened',
      title: 'Opened wheel',
    });
    const someoneElse = await signedIn(t.app, t.ctx);
    await insertJournalRow(t.ctx, someoneElse.member.id, { title: 'Not mine' });
    const res = await maker.get('/api/cave').expect(200);
    expect(res.body.wheels).toHaveLength(1);
    expect(res.body.wheels[0]).toMatchObject({
      journalId: aging,
      ageDays: 30,
      targetDays: 90,
      daysLeft: 60,
      readyDate: daysAgo(-60),
      conditions: { tempC: 11 },
    });
    expect(res.body.wheels[0].progress).toBeCloseTo(1 / 3, 5);
  });

  it('moves a wheel along; only its maker may, with a valid status', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const id = await insertJournalRow(t.ctx, maker.member.id);
    const other = await signedIn(t.app, t.ctx);
    expect((await other.post(`/api/cave/${id}/status`, { wheelStatus: 'discarded' })).status).toBe(
      403,
    );
    const bad = await maker.post(`/api/cave/${id}/status`, { wheelStatus: 'eaten' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.wheelStatus).toBeDefined();
    expect((await maker.post(`/api/cave/${id}/status`, { wheelStatus: 'discarded' })).status).toBe(
      204,
    );
    expect((await maker.get('/api/cave')).body.wheels).toHaveLength(0);
  });
});

describe('reminders', () => {
  it('mails once when a wheel reaches its target, across repeated passes and a restart', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const title = `Ready wheel ${maker.member.handle}`;
    const id = await insertJournalRow(t.ctx, maker.member.id, {
      title,
      makeDate: daysAgo(122),
      agingTargetDays: 120,
    });
    await runReminderPass(t.ctx);
    await runReminderPass(t.ctx);
    // A second app server (a fresh context: another pool), sending through the same mailbox.
    const other = await createTestApp({ SMTP_URL: `smtp://127.0.0.1:${t.ctx.mailbox!.port}` });
    try {
      await runReminderPass(other.ctx);
      await Promise.all([runReminderPass(t.ctx), runReminderPass(other.ctx)]);
    } finally {
      await other.close();
    }
    const mails = [...mailsAbout(title)];
    expect(mails).toHaveLength(1);
    expect(mails[0].to).toEqual([maker.member.email]);
    expect(mails[0].text).toContain(`/journals/${id}/taste`);
    const rows = await t.ctx.database.db
      .select()
      .from(journalReminders)
      .where(eq(journalReminders.journalId, id));
    expect(rows).toHaveLength(1);
    expect(rows[0].sentAt).not.toBeNull();
  });

  it('never mails about opened or discarded wheels, nor members who turned reminders off', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const opened = `Opened ${maker.member.handle}`;
    const discarded = `Discarded ${maker.member.handle}`;
    await insertJournalRow(t.ctx, maker.member.id, {
      title: opened,
      wheelStatus: 'opened',
      makeDate: daysAgo(100),
      agingTargetDays: 60,
    });
    await insertJournalRow(t.ctx, maker.member.id, {
      title: discarded,
      wheelStatus: 'discarded',
      makeDate: daysAgo(100),
      agingTargetDays: 60,
    });
    const quiet = await signedIn(t.app, t.ctx);
    await t.ctx.database.db
      .update(users)
      .set({ remindersEnabled: false })
      .where(eq(users.id, quiet.member.id));
    const quietTitle = `Quiet ${quiet.member.handle}`;
    await insertJournalRow(t.ctx, quiet.member.id, {
      title: quietTitle,
      makeDate: daysAgo(100),
      agingTargetDays: 60,
    });
    await runReminderPass(t.ctx);
    expect(mailsAbout(opened)).toHaveLength(0);
    expect(mailsAbout(discarded)).toHaveLength(0);
    expect(mailsAbout(quietTitle)).toHaveLength(0);
  });

  it('sends the earlier check-date reminder the maker chose, and not before its day', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const title = `Check ${maker.member.handle}`;
    const id = await insertJournalRow(t.ctx, maker.member.id, {
      title,
      makeDate: daysAgo(20),
      agingTargetDays: 90,
      agingCheckDate: daysAgo(-1),
    });
    await runReminderPass(t.ctx);
    expect(mailsAbout(title)).toHaveLength(0);
    await t.ctx.database.db
      .update(journals)
      .set({ agingCheckDate: daysAgo(0) })
      .where(eq(journals.id, id));
    await runReminderPass(t.ctx);
    expect(mailsAbout(title)).toHaveLength(1);
    expect(mailsAbout(title)[0].subject).toMatch(/Time to check/);
  });
});

describe('calendar feed', () => {
  it('serves the ready dates at a secret address and refuses a wrong or reset secret', async () => {
    const maker = await signedIn(t.app, t.ctx);
    await insertJournalRow(t.ctx, maker.member.id, {
      title: 'Feed wheel',
      makeDate: '2026-09-01',
      agingTargetDays: 100,
    });
    expect((await visitor(t.app).get('/api/cave/calendar')).status).toBe(401);
    const { url } = (await maker.get('/api/cave/calendar').expect(200)).body as { url: string };
    const path = new URL(url).pathname;
    const feed = await visitor(t.app).get(path).expect(200);
    expect(feed.headers['content-type']).toMatch(/text\/calendar/);
    expect(feed.text).toContain('BEGIN:VCALENDAR');
    expect(feed.text).toContain('SUMMARY:Ready to taste: Feed wheel');
    expect(feed.text).toContain('DTSTART;VALUE=DATE:20261210');
    const wrong = path.replace(/-[A-Za-z0-9_-]{32}\.ics$/, `-${'x'.repeat(32)}.ics`);
    expect((await visitor(t.app).get(wrong)).status).toBe(404);
    const reset = await maker.post('/api/cave/calendar/reset');
    expect(reset.body.url).not.toBe(url);
    expect((await visitor(t.app).get(path)).status).toBe(404);
    expect((await visitor(t.app).get(new URL(reset.body.url).pathname)).status).toBe(200);
  });
});

describe('raw milk and the 60-day mark', () => {
  it('tells the cave when a raw-milk wheel is ready before its 60-day mark, and only for raw milk', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const raw = await insertJournalRow(t.ctx, maker.member.id, {
      title: 'Raw caerphilly',
      heatTreatment: 'raw',
      makeDate: '2026-12-02',
      agingTargetDays: 45,
    });
    const pasteurised = await insertJournalRow(t.ctx, maker.member.id, {
      title: 'Pasteurised caerphilly',
      makeDate: '2026-12-02',
      agingTargetDays: 45,
    });
    const wheels = (await maker.get('/api/cave').expect(200)).body.wheels as {
      journalId: number;
      readyDate: string;
      rawMilk: unknown;
    }[];
    const rawWheel = wheels.find((w) => w.journalId === raw)!;
    expect(rawWheel.readyDate).toBe('2027-01-16');
    expect(rawWheel.rawMilk).toEqual({
      minimumMetOn: '2027-01-31',
      readyBeforeMinimum: true,
      daysShortAtReady: 15,
    });
    expect(wheels.find((w) => w.journalId === pasteurised)!.rawMilk).toBeNull();
  });

  it('mails the raw-milk rule (for sale, not a safety promise) only for raw-milk wheels, and does not call one under 60 days ready', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const young = `Young raw ${maker.member.handle}`;
    const old = `Old raw ${maker.member.handle}`;
    const plain = `Pasteurised ${maker.member.handle}`;
    await insertJournalRow(t.ctx, maker.member.id, {
      title: young,
      heatTreatment: 'raw',
      makeDate: daysAgo(46),
      agingTargetDays: 45,
    });
    await insertJournalRow(t.ctx, maker.member.id, {
      title: old,
      heatTreatment: 'thermised',
      makeDate: daysAgo(100),
      agingTargetDays: 90,
    });
    await insertJournalRow(t.ctx, maker.member.id, {
      title: plain,
      makeDate: daysAgo(100),
      agingTargetDays: 90,
    });
    await runReminderPass(t.ctx);
    const [youngMail] = mailsAbout(young);
    expect(youngMail.subject).toBe(`Aging target reached (raw milk, under 60 days): ${young}`);
    expect(youngMail.text).toContain(`reaches on ${dayInWords(daysAgo(-14))}`);
    expect(youngMail.text).toMatch(
      /at least 60 days at no less than 1\.7 °C \(35 °F\) before it is sold \(21 CFR 133\.113/,
    );
    expect(youngMail.text).toMatch(/not a promise that the cheese is safe to eat/);
    expect(youngMail.text).toMatch(/pregnant people, young children, older adults/);
    const [oldMail] = mailsAbout(old);
    expect(oldMail.subject).toBe(`Ready to taste: ${old}`);
    expect(oldMail.text).toMatch(/unpasteurised milk.*before it is sold/);
    const [plainMail] = mailsAbout(plain);
    expect(plainMail.subject).toBe(`Ready to taste: ${plain}`);
    expect(plainMail.text).not.toMatch(/raw|unpasteurised|60 days/i);
  });

  it('marks the calendar event of a raw-milk wheel ready before 60 days', async () => {
    const maker = await signedIn(t.app, t.ctx);
    await insertJournalRow(t.ctx, maker.member.id, {
      title: 'Raw feed wheel',
      heatTreatment: 'raw',
      makeDate: '2026-12-02',
      agingTargetDays: 45,
    });
    const { url } = (await maker.get('/api/cave/calendar').expect(200)).body as { url: string };
    const feed = await visitor(t.app).get(new URL(url).pathname).expect(200);
    const unfolded = feed.text.replace(/\r\n[ \t]/g, '');
    expect(unfolded).toContain(
      'SUMMARY:Aging target reached (raw milk\\, under 60 days): Raw feed wheel',
    );
    expect(unfolded).toContain('before the 60-day mark (31 Jan 2027)');
  });
});

describe('opened wheels stop aging', () => {
  it('records the day a wheel leaves the cave as opened, keeps it when finished, clears it when put back', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const id = await insertJournalRow(t.ctx, maker.member.id, {
      makeDate: daysAgo(47),
      agingTargetDays: 42,
    });
    const openedOn = async () =>
      (
        await t.ctx.database.db
          .select({ openedOn: journals.openedOn })
          .from(journals)
          .where(eq(journals.id, id))
      )[0].openedOn;
    expect((await maker.post(`/api/cave/${id}/status`, { wheelStatus: 'opened' })).status).toBe(
      204,
    );
    expect(await openedOn()).toBe(daysAgo(0));
    const page = (await maker.get(`/api/journals/${id}`).expect(200)).body.derived.aging;
    expect(page).toMatchObject({
      cut: true,
      openedOn: daysAgo(0),
      ageAtOpeningDays: 47,
    });
    // Later, finishing it keeps the opening day.
    await t.ctx.database.db
      .update(journals)
      .set({ openedOn: daysAgo(60) })
      .where(eq(journals.id, id));
    expect((await maker.post(`/api/cave/${id}/status`, { wheelStatus: 'finished' })).status).toBe(
      204,
    );
    expect(await openedOn()).toBe(daysAgo(60));
    expect((await maker.post(`/api/cave/${id}/status`, { wheelStatus: 'aging' })).status).toBe(204);
    expect(await openedOn()).toBeNull();
    const back = (await maker.get(`/api/journals/${id}`).expect(200)).body.derived.aging;
    expect(back).toMatchObject({ cut: false, openedOn: null, ageAtOpeningDays: null });
  });

  it("takes the maker's first tasting as the opening day", async () => {
    const maker = await signedIn(t.app, t.ctx);
    const id = await insertJournalRow(t.ctx, maker.member.id, { makeDate: daysAgo(50) });
    const tasted = await maker.post(`/api/journals/${id}/tastings`, {
      tastedOn: daysAgo(3),
      overall: 7,
      appearance: 7,
      aroma: 7,
      flavour: 7,
      texture: 7,
      finish: 7,
      descriptors: [],
      defects: [],
      notes: '',
    });
    expect(tasted.status).toBe(201);
    const aging = (await maker.get(`/api/journals/${id}`).expect(200)).body.derived.aging;
    expect(aging).toMatchObject({ cut: true, openedOn: daysAgo(3), ageAtOpeningDays: 47 });
    // The cards and the table say the same age: 47 days, not the running 50.
    const mine = (await maker.get('/api/journals?mine=true').expect(200)).body.items;
    expect(mine.find((j: { id: number }) => j.id === id)).toMatchObject({ ageDays: 47 });
    expect((await maker.get(`/api/journals/${id}`).expect(200)).body.ageDays).toBe(47);
  });
});

import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runReminderPass } from '../../server/services/reminders.service';
import { startE2E, type E2E } from '../support/browser';
import { createMember } from '../support/factories';
import { daysAgo, insertJournalRow } from '../support/journal-rows';

type Mail = { to: string[]; subject: string; text: string };
const PHONE = { width: 390, height: 844 };

/** Waits until the locator shows the text (playwright-core has no expect of its own). */
const shows = (where: Locator, text: string | RegExp) =>
  where.filter({ hasText: text }).first().waitFor();

describe('the tasting journey in Chromium', () => {
  let e: E2E;
  beforeAll(async () => {
    e = await startE2E();
  });
  afterAll(() => e?.close());

  async function mailFor(email: string, subject: RegExp): Promise<Mail> {
    for (let i = 0; i < 50; i++) {
      const res = await fetch(`${e.baseUrl}/api/dev/mail`);
      const { messages } = (await res.json()) as { messages: Mail[] };
      const found = messages.find((m) => m.to.includes(email) && subject.test(m.subject));
      if (found) return found;
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error(`no mail "${subject}" for ${email}`);
  }

  async function signIn(page: Page, email: string, password: string) {
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
  }

  it('a wheel made four months ago: the reminder mail, its link, the scorecard, the score on the journal and in Discover', async () => {
    const maker = await createMember(e.t.ctx);
    const title = `Harbour cheddar ${maker.handle.slice(-5)}`;
    const journalId = await insertJournalRow(e.t.ctx, maker.id, {
      title,
      makeDate: daysAgo(122),
      agingTargetDays: 120,
      agingTempC: 11,
      agingHumidityPercent: 85,
      status: 'published',
      visibility: 'public',
      wheelStatus: 'aging',
    });

    await runReminderPass(e.t.ctx);
    const mail = await mailFor(maker.email, /Ready to taste/);
    expect(mail.text).toContain(title);
    const link = new RegExp(`https?://\\S+/journals/${journalId}/taste`).exec(mail.text)?.[0];
    expect(link?.startsWith(e.baseUrl)).toBe(true);

    const { page, problems } = await e.newPage(PHONE);
    await page.goto(link!);
    // Signed out: the scorecard asks for a sign-in first and comes back afterwards.
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await signIn(page, maker.email, maker.password);
    await page.getByRole('heading', { name: 'Score this wheel' }).waitFor();
    await page.getByText('Age at tasting').getByText('122 days').waitFor();
    await e.screenshot(page, 'tasting-form-phone-empty');

    // Saving with nothing chosen names what is missing.
    await page.getByRole('button', { name: 'Save my tasting' }).click();
    await page.getByText('Score overall liking from 1 to 9.').waitFor();

    const scores: [string, string][] = [
      ['Overall liking', '8, Like very much'],
      ['Appearance', '7, Like moderately'],
      ['Aroma', '7, Like moderately'],
      ['Flavour', '8, Like very much'],
      ['Body and texture', '6, Like slightly'],
      ['Finish', '7, Like moderately'],
    ];
    for (const [group, score] of scores)
      await page
        .getByRole('radiogroup', { name: group })
        .getByRole('radio', { name: score })
        .click();
    await page
      .getByRole('radiogroup', { name: 'Overall liking' })
      .getByRole('radio', { name: '8, Like very much', checked: true })
      .waitFor();
    await page.getByRole('button', { name: 'Nutty', exact: true }).click();
    await page.getByRole('button', { name: 'Brothy', exact: true }).click();
    await page.getByRole('button', { name: 'Salty', exact: true }).click();
    await page.getByRole('button', { name: 'Crumbly', exact: true }).click();
    await page
      .getByLabel('Notes')
      .fill('Opened at the club. **Nutty**, a little crumbly at the rind.');
    await e.screenshot(page, 'tasting-form-phone-filled');
    await page.getByRole('button', { name: 'Save my tasting' }).click();
    await page.waitForURL(new RegExp(`/journals/${journalId}#tastings$`)).catch(async (err) => {
      await e.screenshot(page, 'failure-after-save');
      throw new Error(`${err}; problems: ${problems.join(' | ')}`);
    });
    const panel = page.getByRole('region', { name: 'Tastings' });
    const card = panel.getByRole('article', { name: `Tasting by ${maker.displayName}` });
    await card.waitFor();
    await shows(card, '8');
    await shows(card, '122 days');
    await shows(card, 'Nutty');
    await shows(card, 'Crumbly');
    await shows(panel.getByRole('table'), '3 to 6 months');
    await panel.locator('canvas').first().waitFor();
    await e.screenshot(page, 'journal-tastings-phone');

    // Discover's mean score follows the new tasting.
    await page.goto(`${e.baseUrl}/?maker=${maker.handle}`);
    const result = page.getByRole('article').filter({ hasText: title });
    await shows(result, '8.0');
    await shows(result, '1 tasting');
    await e.screenshot(page, 'discover-mean-score-phone');

    // The taster changes their mind: the scorecard opens filled in, and the change shows.
    await page.goto(`${e.baseUrl}/journals/${journalId}`);
    await card.getByRole('button', { name: 'Change' }).click();
    await page.getByRole('heading', { name: 'Change your tasting' }).waitFor();
    await page
      .getByRole('radiogroup', { name: 'Body and texture' })
      .getByRole('radio', { name: '6, Like slightly', checked: true })
      .waitFor();
    await page
      .getByRole('radiogroup', { name: 'Overall liking' })
      .getByRole('radio', { name: '7, Like moderately' })
      .click();
    await page.getByRole('button', { name: 'Save the changes' }).click();
    await page.waitForURL(new RegExp(`/journals/${journalId}#tastings$`));
    await shows(card, 'Overall: Like moderately');
    await shows(panel.getByRole('table'), '7.0');

    // The reminder goes once: another pass sends nothing more for this wheel.
    await runReminderPass(e.t.ctx);
    const res = await fetch(`${e.baseUrl}/api/dev/mail`);
    const { messages } = (await res.json()) as { messages: Mail[] };
    expect(
      messages.filter((m) => m.to.includes(maker.email) && /Ready to taste/.test(m.subject)),
    ).toHaveLength(1);
    expect(problems).toEqual([]);
  });

  it('the cave in US units, a weigh-in, and a friend scoring through the invite link', async () => {
    const maker = await createMember(e.t.ctx, { units: 'us' });
    const friend = await createMember(e.t.ctx);
    const ready = await insertJournalRow(e.t.ctx, maker.id, {
      title: 'Club night gouda',
      makeDate: daysAgo(95),
      agingTargetDays: 90,
      agingTempC: 12,
      agingHumidityPercent: 85,
      wheelStatus: 'aging',
    });
    await insertJournalRow(e.t.ctx, maker.id, {
      title: 'Spring tomme',
      makeDate: daysAgo(20),
      agingTargetDays: 60,
      agingTempC: 10,
      wheelStatus: 'aging',
    });
    await insertJournalRow(e.t.ctx, maker.id, {
      title: 'Raw-milk caerphilly',
      makeDate: daysAgo(3),
      agingTargetDays: 45,
      heatTreatment: 'raw',
      wheelStatus: 'drying',
    });

    // One browser profile for the whole file: the first journey's maker is still signed in.
    await e.browser.clearCookies();
    const { page, problems } = await e.newPage();
    await page.goto(`${e.baseUrl}/signin`);
    await signIn(page, maker.email, maker.password);
    await page.getByRole('heading', { name: 'Discover make journals' }).waitFor();
    await page.goto(`${e.baseUrl}/cave`);
    const wheels = page.getByRole('list', { name: 'Wheels in the cave' }).getByRole('article');
    await expect.poll(() => wheels.count()).toBe(3);
    // Soonest ready first.
    await shows(wheels.first(), 'Club night gouda');
    await shows(wheels.first(), 'Ready for 5 days');
    await shows(wheels.first(), '53.6 °F');
    await shows(wheels.nth(1), '40 days left');
    await page.getByLabel('Your secret calendar address').waitFor();
    await e.screenshot(page, 'cave-desktop');

    await wheels.first().getByRole('button', { name: 'Record a weigh-in' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Weight of the wheel (lb)').fill('3.5');
    await e.screenshot(page, 'cave-weigh-in-dialog');
    await dialog.getByRole('button', { name: 'Save the weigh-in' }).click();
    await shows(wheels.first(), '3.5 lb');

    // The maker invites friends on the journal page.
    await page.goto(`${e.baseUrl}/journals/${ready}`);
    const panel = page.getByRole('region', { name: 'Tastings' });
    await panel.getByRole('button', { name: 'Invite tasters' }).click();
    const inviteUrl = await panel.getByLabel('Invite link').inputValue();
    expect(inviteUrl).toMatch(new RegExp(`/journals/${ready}/taste\\?invite=`));
    await panel.getByText('Works until').waitFor();
    await e.screenshot(page, 'journal-invite-desktop');

    // A friend at the meeting opens the link on their phone (one browser profile: sign out first).
    await e.browser.clearCookies();
    await page.setViewportSize(PHONE);
    await page.goto(inviteUrl);
    await signIn(page, friend.email, friend.password);
    await page.getByText('invited you to score this wheel').waitFor();
    for (const group of [
      'Overall liking',
      'Appearance',
      'Aroma',
      'Flavour',
      'Body and texture',
      'Finish',
    ])
      await page
        .getByRole('radiogroup', { name: group })
        .getByRole('radio', { name: /^6,/ })
        .click();
    await page.getByRole('button', { name: 'Save my tasting' }).click();
    await page.waitForURL(new RegExp(`/journals/${ready}\\?invite=[^#]+#tastings$`));
    await page
      .getByRole('article', { name: `Tasting by ${friend.displayName}` })
      .getByText('6')
      .first()
      .waitFor();

    await e.screenshot(page, 'journal-two-tasters-phone');

    await e.browser.clearCookies();
    await page.setViewportSize({ width: 1280, height: 900 });
    await page.goto(`${e.baseUrl}/signin`);
    await signIn(page, maker.email, maker.password);
    await page.getByRole('heading', { name: 'Discover make journals' }).waitFor();

    // Opening the wheel from the cave leads to the scorecard; the wheel leaves the cave.
    await page.goto(`${e.baseUrl}/cave`);
    await wheels.first().getByRole('button', { name: 'Mark opened and score' }).click();
    await page.getByRole('heading', { name: 'Score this wheel' }).waitFor();
    await page.goto(`${e.baseUrl}/cave`);
    await expect.poll(() => wheels.count()).toBe(2);
    await page.setViewportSize(PHONE);
    await e.screenshot(page, 'cave-phone');
    expect(problems).toEqual([]);
  });
});

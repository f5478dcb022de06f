import { eq } from 'drizzle-orm';
import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { journalWeighIns, styles } from '../../server/db/schema';
import { startE2E, type E2E } from '../support/browser';
import { createMember } from '../support/factories';
import { daysAgo, insertJournalRow } from '../support/journal-rows';

const PHONE = { width: 390, height: 844 };
const shows = (where: Locator, text: string | RegExp) =>
  where.filter({ hasText: text }).first().waitFor();

// What a maker and a taster see around raw milk, opened wheels, invites, weigh-ins and the
// scorecard's terms.
describe('cave and scorecard cautions in Chromium', () => {
  let e: E2E;
  beforeAll(async () => {
    e = await startE2E();
  });
  afterAll(() => e?.close());

  async function signIn(page: Page, email: string, password: string) {
    await page.goto(`${e.baseUrl}/signin`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Discover make journals' }).waitFor();
  }

  it('raw milk before 60 days in the cave, a doubtful weigh-in with a decimal comma, and the scorecard terms of a Caerphilly', async () => {
    const maker = await createMember(e.t.ctx);
    const [caerphilly] = await e.t.ctx.database.db
      .select({ id: styles.id })
      .from(styles)
      .where(eq(styles.slug, 'caerphilly'));
    const raw = await insertJournalRow(e.t.ctx, maker.id, {
      title: 'Raw-milk caerphilly',
      styleId: caerphilly.id,
      makeDate: daysAgo(50),
      agingTargetDays: 45,
      heatTreatment: 'raw',
      wheelStatus: 'aging',
    });
    await e.t.ctx.database.db
      .insert(journalWeighIns)
      .values({ journalId: raw, date: daysAgo(7), massKg: 1.48, note: '' });
    await e.browser.clearCookies();
    const { page, problems } = await e.newPage();
    await page.setViewportSize(PHONE);
    await signIn(page, maker.email, maker.password);
    await page.goto(`${e.baseUrl}/cave`);
    const card = page.getByRole('article').filter({ hasText: 'Raw-milk caerphilly' });
    await shows(card, 'Target reached 5 days ago');
    await shows(card, /comes before the 60-day mark/);
    await shows(card, /before sale; that is not a promise it is safe to eat/);
    expect(await card.textContent()).not.toMatch(/Ready (since|for)/);
    await card.getByRole('note').scrollIntoViewIfNeeded();
    await e.screenshot(page, 'cave-raw-milk-phone');

    // 2 kg after 1.48 kg, typed with a decimal comma: read right, then asked about once.
    await card.getByRole('button', { name: 'Record a weigh-in' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Weight of the wheel (kg)').fill('2,0');
    await dialog.getByText('Read as 2 kg').waitFor();
    await dialog.getByRole('button', { name: 'Save the weigh-in' }).click();
    await dialog.getByText(/35\.1 % heavier than the last weigh-in/).waitFor();
    await e.screenshot(page, 'cave-weigh-in-doubt-phone');
    await dialog.getByLabel('Weight of the wheel (kg)').fill('1,45');
    await dialog.getByRole('button', { name: 'Save the weigh-in' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await shows(card, '1.45 kg');

    // The scorecard: the raw-milk caution, no "Crumbly" defect for a Caerphilly, meanings on tap.
    await page.goto(`${e.baseUrl}/journals/${raw}/taste`);
    await page
      .getByText(/pregnant people, young children, older adults/)
      .first()
      .waitFor();
    const defects = page.getByRole('group', { name: 'Defects' });
    await defects.getByText(/Not counted as defects for a Caerphilly-type.*crumbly/).waitFor();
    expect(await defects.getByRole('button', { name: /^\+ Crumbly/ }).count()).toBe(0);
    const descriptors = page.getByRole('group', { name: 'Flavour descriptors' });
    await descriptors.getByRole('button', { name: 'What Catty means' }).click();
    await descriptors.getByText(/Catty:.*tomato leaves/).waitFor();
    await defects.getByRole('button', { name: 'What Seamy means' }).click();
    await defects.getByText(/Seamy:.*where curd pieces joined/).waitFor();
    await defects.getByRole('button', { name: /Seamy/ }).first().click();
    await defects.getByRole('button', { name: 'What Seamy means' }).scrollIntoViewIfNeeded();
    await e.screenshot(page, 'scorecard-terms-phone');
    expect(problems).toEqual([]);
  });

  it('an opened camembert shows its age at opening; a draft offers no invite, only the reason', async () => {
    const maker = await createMember(e.t.ctx);
    const opened = await insertJournalRow(e.t.ctx, maker.id, {
      title: 'Opened camembert',
      makeDate: daysAgo(106),
      agingTargetDays: 42,
      wheelStatus: 'opened',
      openedOn: daysAgo(59),
    });
    const draft = await insertJournalRow(e.t.ctx, maker.id, {
      title: 'Draft tomme',
      status: 'draft',
      publishedAt: null,
    });
    await e.browser.clearCookies();
    const { page, problems } = await e.newPage();
    await page.setViewportSize({ width: 1280, height: 900 });
    await signIn(page, maker.email, maker.password);
    await page.goto(`${e.baseUrl}/journals/${opened}`);
    const figures = page.getByRole('region', { name: 'Worked-out figures' });
    await shows(figures, 'Age at opening');
    await shows(figures, '47 days');
    await shows(figures, 'opened 5 days after its target');
    const text = (await figures.textContent()) ?? '';
    expect(text).not.toMatch(/Reached \d+ days ago|3\.5 months/);
    await figures.getByText('Age at opening').scrollIntoViewIfNeeded();
    await e.screenshot(page, 'journal-opened-age');

    await page.goto(`${e.baseUrl}/journals/${draft}`);
    const panel = page.getByRole('region', { name: 'Tastings' });
    await panel.getByText(/still a draft.*Publish it first/).waitFor();
    expect(await panel.getByRole('button', { name: 'Invite tasters' }).count()).toBe(0);
    await panel.getByText(/still a draft/).scrollIntoViewIfNeeded();
    await e.screenshot(page, 'journal-draft-no-invite');
    expect(problems).toEqual([]);
  });
});

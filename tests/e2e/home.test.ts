import { existsSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startE2E, type E2E } from '../support/browser';

describe('home page in Chromium', () => {
  let e: E2E;
  beforeAll(async () => {
    e = await startE2E();
  });
  afterAll(() => e?.close());

  it('shows the Discover heading, the styles, and no console error', async () => {
    const { page, problems } = await e.newPage();
    await page.goto(e.baseUrl, { waitUntil: 'networkidle' });
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe(
      'Discover make journals',
    );
    await page.getByRole('heading', { name: 'Styles you can record' }).waitFor();
    await page.getByText('Cheddar', { exact: true }).first().waitFor();
    const file = await e.screenshot(page, 'home-desktop');
    expect(existsSync(file)).toBe(true);
    expect(problems).toEqual([]);
  });

  it('works on a phone-sized screen, with the menu behind a button', async () => {
    const { page, problems } = await e.newPage({ width: 390, height: 844 });
    await page.goto(e.baseUrl, { waitUntil: 'networkidle' });
    const menu = page.getByRole('button', { name: 'Menu' });
    await expect(menu.isVisible()).resolves.toBe(true);
    await menu.click();
    await page.getByRole('link', { name: 'Compare' }).click();
    await page.getByRole('heading', { name: 'Compare', level: 1 }).waitFor();
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(390);
    await e.screenshot(page, 'compare-phone');
    expect(problems).toEqual([]);
  });

  it('says what a search found nothing for, and warns of an aging range that cannot match', async () => {
    const { page, problems } = await e.newPage();
    await page.goto(`${e.baseUrl}/?q=quuxcurd`, { waitUntil: 'networkidle' });
    await page.getByRole('heading', { name: 'No journal mentions “quuxcurd”' }).waitFor();
    await page.getByRole('button', { name: 'Clear the search' }).click();
    await expect(page.getByLabel('Search titles and notes').inputValue()).resolves.toBe('');

    await page.getByLabel('From (days)').fill('240');
    await page.getByLabel('To (days)').fill('60');
    await page.getByLabel('To (days)').blur();
    await page
      .getByText('60 days is before 240: no batch can match. Swap them or clear one.')
      .waitFor();
    expect(problems).toEqual([]);
  });

  it('shows a 404 page for an unknown address', async () => {
    const { page } = await e.newPage();
    await page.goto(`${e.baseUrl}/no/such/page`);
    await page.getByRole('heading', { name: 'Page not found' }).waitFor();
  });
});

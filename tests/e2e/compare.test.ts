import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tastings } from '../../server/db/schema/tastings';
import { SCREENSHOT_DIR, startE2E, type E2E } from '../support/browser';
import { eq } from 'drizzle-orm';
import { styles } from '../../server/db/schema';
import { createMember } from '../support/factories';
import { daysAgo, insertJournalRow } from '../support/journal-rows';
import { refreshJournalTastingStats } from '../../server/repositories/tastings.repository';

const DESKTOP = { width: 1280, height: 900 };
const PHONE = { width: 390, height: 844 };

// Eight public cheddars by one maker, salt from 1.6 to 3.7 g/L, each scored once: overall
// liking rises with salt (a planted slope of about 1.2 points per g/L). Three have a long aging
// target, so filtering on it leaves too few points for a line.
const BATCHES = [
  { salt: 1.6, overall: 5, cook: 37.5, aging: 90 },
  { salt: 1.9, overall: 5, cook: 38, aging: 90 },
  { salt: 2.2, overall: 6, cook: 38, aging: 90 },
  { salt: 2.5, overall: 6, cook: 38.5, aging: 90 },
  { salt: 2.8, overall: 7, cook: 39, aging: 90 },
  { salt: 3.1, overall: 7, cook: 39, aging: 240 },
  { salt: 3.4, overall: 8, cook: 39.5, aging: 240 },
  { salt: 3.7, overall: 8, cook: 40, aging: 240 },
];

// Like the user trial: seven batches of two styles, each wheel tasted four times, with the
// tastings of one wheel close together. Per tasting the salt slope's interval lies above zero;
// per batch (each wheel's mean) it runs from below zero to above it, with r about 0.51.
const TRIAL = [
  { style: 'camembert', salt: 1.8, heat: 'pasteurised', scores: [6, 6, 6, 7] },
  { style: 'camembert', salt: 2.1, heat: 'pasteurised', scores: [5, 5, 5, 6] },
  { style: 'camembert', salt: 2.4, heat: 'raw', scores: [7, 7, 7, 7] },
  { style: 'camembert', salt: 2.7, heat: 'pasteurised', scores: [5, 6, 6, 5] },
  { style: 'feta', salt: 3.0, heat: 'pasteurised', scores: [7, 8, 8, 7] },
  { style: 'feta', salt: 3.3, heat: 'raw', scores: [8, 8, 8, 7] },
  { style: 'feta', salt: 3.6, heat: 'pasteurised', scores: [6, 7, 7, 6] },
] as const;

// echarts animates points and boxes in; let it settle before a screenshot.
const settle = (page: Page) => page.waitForTimeout(700);

async function noSidewaysScroll(page: Page) {
  const width = await page.evaluate(() => document.documentElement.scrollWidth);
  expect(width).toBeLessThanOrEqual(PHONE.width);
}

describe('Compare in Chromium', () => {
  let e: E2E;
  let handle: string;
  const ids: number[] = [];
  const title = (i: number) => `Salt trial ${i + 1}`;

  beforeAll(async () => {
    e = await startE2E();
    const maker = await createMember(e.t.ctx);
    handle = maker.handle;
    for (const [i, b] of BATCHES.entries()) {
      const id = await insertJournalRow(e.t.ctx, maker.id, {
        title: title(i),
        makeDate: daysAgo(120 + i),
        metricSaltGPerL: b.salt,
        metricCookTempC: b.cook,
        agingTargetDays: b.aging,
        rindTreatment: i < 4 ? 'waxed' : 'cloth-bound',
      });
      ids.push(id);
      await e.t.ctx.database.db.insert(tastings).values({
        journalId: id,
        tasterId: maker.id,
        tastedOn: daysAgo(0),
        ageDays: 60 + i * 5,
        overall: b.overall,
        appearance: 6,
        aroma: 6,
        flavour: b.overall,
        texture: 6,
        finish: 6,
        descriptors: [],
        defects: [],
        notes: '',
      });
      await refreshJournalTastingStats(e.t.ctx.database.db, id);
    }
  });
  afterAll(() => e?.close());

  it('relates salt per litre to overall liking for cheddar and opens a point’s journal', async () => {
    const { page, problems } = await e.newPage(DESKTOP);
    await page.goto(`${e.baseUrl}/compare`);
    await page.getByRole('heading', { name: 'Compare', level: 1 }).waitFor();

    await page.getByLabel('Make parameter (across)').selectOption('saltPerLitre');
    await page.getByLabel('Result (up)').selectOption('overall');
    // The style box is naive-ui's select: open it, type to filter, pick the style.
    await page
      .locator('.n-form-item', { has: page.getByText('Style', { exact: true }) })
      .locator('.n-base-selection')
      .click();
    await page.keyboard.type('Cheddar');
    await page.locator('.n-base-select-option', { hasText: /^Cheddar$/ }).click();
    await page.keyboard.press('Escape');
    await page.waitForURL(/style=cheddar/);
    // Other tests leave cheddars in the shared database: narrow to this maker's batches.
    await page.getByLabel("Maker's handle").fill(`@${handle}`);
    await page.getByLabel("Maker's handle").press('Enter');
    await page.waitForURL(new RegExp(`maker=${handle}`));
    expect(page.url()).toContain('x=saltPerLitre');
    expect(page.url()).toContain('y=overall');

    await page.locator('canvas').first().waitFor();
    const reading = page.getByRole('region', { name: 'What the chart says' });
    await reading
      .getByText(
        new RegExp(
          `^Across 8 batches of Cheddar, made by @${handle} \\(each the mean of its tastings\\), each extra gram of salt per litre of milk went with \\+1\\.\\d+ points of overall liking \\(95 % interval \\+\\d`,
        ),
      )
      .waitFor();
    await reading.getByText(/The whole interval is above zero/).waitFor();
    await reading.getByText(/^r = 0\.9\d over 8 batches: a large correlation by Cohen/).waitFor();
    await reading.getByText(/not a controlled trial/).waitFor();
    await settle(page);
    await e.screenshot(page, 'compare-desktop');

    // The same points as a table under the chart, each a link to its journal.
    await page.getByText('See the 8 points as a table').click();
    const table = page.getByRole('table', { name: /The 8 points/ });
    await table
      .getByRole('row', { name: /Salt trial 4/ })
      .getByText('2.5 g/L')
      .waitFor();
    await table.getByRole('link', { name: title(3) }).click();
    await page.waitForURL(new RegExp(`/journals/${ids[3]}$`));
    await page.getByRole('heading', { name: title(3), level: 1 }).waitFor();

    // Back on the shared link: a category as x draws one box per group with its count.
    await page.goBack();
    await page.getByLabel('Make parameter (across)').selectOption('rindTreatment');
    await page.waitForURL(/x=rindTreatment/);
    await page.getByRole('img', { name: /Box plot of Overall liking/ }).waitFor();
    await reading
      .getByText(
        /^Across 8 batches of Cheddar, .*the highest average overall liking was for cloth-bound \(7\.5 over 4 batches\) and the lowest for waxed \(5\.5 over 4 batches\)\./,
      )
      .waitFor();
    await settle(page);
    await e.screenshot(page, 'compare-boxplot-desktop');
    expect(problems).toEqual([]);
  });

  it('says when there are too few points for a line, and when nothing matches', async () => {
    const { page, problems } = await e.newPage(DESKTOP);
    await page.goto(
      `${e.baseUrl}/compare?x=cookTemp&y=overall&style=cheddar&maker=${handle}&agingMin=200`,
    );
    const reading = page.getByRole('region', { name: 'What the chart says' });
    await reading
      .getByText(/^Across 3 batches of Cheddar, with an aging target of at least 200 days/)
      .waitFor();
    await reading
      .getByText('Only 3 batches: with fewer than 5, a fitted line would not mean anything.')
      .waitFor();
    await reading.getByText(/not a controlled trial/).waitFor();

    await page.goto(`${e.baseUrl}/compare?x=saltPerLitre&y=overall&maker=nobody-here-${handle}`);
    await page.getByRole('heading', { name: 'No batches match these filters yet' }).waitFor();
    await page.getByRole('status').getByRole('button', { name: 'Clear the filters' }).waitFor();
    expect(problems).toEqual([]);
  });

  it('reads in US units on a phone without scrolling sideways', async () => {
    const { page, problems } = await e.newPage(PHONE);
    await page.goto(`${e.baseUrl}/compare?x=cookTemp&y=overall&style=cheddar&maker=${handle}`);
    await page.locator('canvas').first().waitFor();
    await page.getByText('US', { exact: true }).click();
    const reading = page.getByRole('region', { name: 'What the chart says' });
    await reading.getByText(/each 1 °F higher cooking temperature went with \+/).waitFor();
    await noSidewaysScroll(page);
    await settle(page);
    await e.screenshot(page, 'compare-phone-us');
    await page.getByText('Metric', { exact: true }).click();
    await reading.getByText(/each 1 °C higher cooking temperature/).waitFor();
    expect(problems).toEqual([]);
  });

  it('picks journals in Discover and sets them side by side', async () => {
    const { page, problems } = await e.newPage(DESKTOP);
    await page.goto(`${e.baseUrl}/?maker=${handle}`);
    await page
      .getByRole('article')
      .filter({ hasText: title(0) })
      .waitFor();
    await page.getByRole('button', { name: 'Compare side by side' }).click();
    await page.getByLabel(`Pick “${title(0)}” to compare`).check();
    await page.getByLabel(`Pick “${title(7)}” to compare`).check();
    await e.screenshot(page, 'compare-discover-picking');
    await page.getByRole('button', { name: 'Compare 2 side by side' }).click();
    await page.waitForURL(/\/compare\/journals\?ids=/);
    expect(new URL(page.url()).searchParams.get('ids')?.split(',').map(Number).sort()).toEqual(
      [ids[0], ids[7]].sort(),
    );

    await page.getByRole('heading', { name: 'Journals side by side', level: 1 }).waitFor();
    const salt = page.getByRole('row', { name: /Salt per litre of milk/ });
    await salt.getByText('differs').waitFor();
    await salt.getByText('1.6 g per L').waitFor();
    await salt.getByText('3.7 g per L').waitFor();
    await page
      .getByRole('link', { name: title(7) })
      .first()
      .waitFor();
    await page.getByRole('heading', { name: 'Scores at matched ages' }).waitFor();
    await e.screenshot(page, 'compare-journals-desktop');

    const style = page.getByRole('row', { name: /^Style/ });
    await style.waitFor();
    await page.getByText(/Show only differences/).click();
    await style.waitFor({ state: 'detached' });
    await salt.waitFor();
    expect(problems).toEqual([]);
  });

  it('starts from a journal page and reads side by side on a phone', async () => {
    const { page, problems } = await e.newPage(PHONE);
    await page.goto(`${e.baseUrl}/journals/${ids[2]}`);
    await page.getByRole('heading', { name: title(2), level: 1 }).waitFor();
    await page.getByRole('button', { name: 'Compare with another journal' }).click();
    await page.waitForURL(
      (url) => url.pathname === '/' && url.searchParams.get('style') === 'cheddar',
    );
    const bar = page.getByRole('region', { name: 'Journals picked to compare' });
    await bar.getByText(title(2), { exact: true }).waitFor();
    await noSidewaysScroll(page);
    await page.screenshot({ path: `${SCREENSHOT_DIR}/compare-discover-phone.png` });

    await page.goto(`${e.baseUrl}/compare/journals?ids=${ids[1]},${ids[4]},${ids[6]}`);
    await page
      .getByRole('row', { name: /Cooking temperature/ })
      .getByText('38 °C')
      .waitFor();
    await noSidewaysScroll(page);
    // The table scrolls inside its box; the row labels stay put.
    const wrap = page.getByLabel('The journals side by side (scrolls sideways)');
    const label = page.getByRole('rowheader', { name: /Cooking temperature/ });
    const before = await label.boundingBox();
    await wrap.evaluate((el) => el.scrollBy({ left: 400 }));
    const after = await label.boundingBox();
    expect(after?.x).toBe(before?.x);
    await wrap.evaluate((el) => el.scrollTo({ left: 0 }));
    await e.screenshot(page, 'compare-journals-phone');

    await page.goto(`${e.baseUrl}/compare/journals?ids=${ids[1]},999999`);
    await page.getByRole('heading', { name: 'One of these journals is not available' }).waitFor();
    expect(problems.filter((p) => !p.includes('404'))).toEqual([]);
  });
});

describe('Compare reads honestly to a home cheesemaker', () => {
  let e: E2E;
  let handle: string;

  beforeAll(async () => {
    e = await startE2E();
    const db = e.t.ctx.database.db;
    const maker = await createMember(e.t.ctx);
    handle = maker.handle;
    for (const [i, b] of TRIAL.entries()) {
      const [style] = await db
        .select({ id: styles.id })
        .from(styles)
        .where(eq(styles.slug, b.style));
      const id = await insertJournalRow(e.t.ctx, maker.id, {
        title: `Trial ${b.style} ${i + 1}`,
        styleId: style.id,
        makeDate: daysAgo(150 + i),
        metricSaltGPerL: b.salt,
        heatTreatment: b.heat,
      });
      for (const [k, overall] of b.scores.entries()) {
        await db.insert(tastings).values({
          journalId: id,
          tasterId: maker.id,
          tastedOn: daysAgo(40 - k * 10),
          ageDays: 70 + k * 10,
          overall,
          appearance: 6,
          aroma: 6,
          flavour: overall,
          texture: 6,
          finish: 6,
          descriptors: [],
          defects: [],
          notes: '',
        });
      }
      await refreshJournalTastingStats(db, id);
    }
  });
  afterAll(() => e?.close());

  it('counts batches by default, and says why one point per tasting is too sure of itself', async () => {
    const { page, problems } = await e.newPage(DESKTOP);
    await page.goto(`${e.baseUrl}/compare?x=saltPerLitre&y=overall&maker=${handle}`);
    const reading = page.getByRole('region', { name: 'What the chart says' });
    await reading.getByText(/^Across/).waitFor();
    await settle(page);
    await e.screenshot(page, 'compare-trial-default-desktop');

    await reading
      .getByText(
        /^Across 7 batches, made by @.*\(each the mean of its tastings\), each extra gram of salt per litre of milk went with \+0\.74 points of overall liking \(95 % interval \u22120\.71 to \+2\.2\)\./,
      )
      .waitFor();
    await reading.getByText(/do not show a clear direction/).waitFor();
    await reading.getByText(/holds the true slope 95 times in 100/).waitFor();
    await reading.getByText(/^r = 0\.51 over 7 batches/).waitFor();
    await reading.getByText(/Cohen/).waitFor();
    await reading.getByText(/not a cause/).waitFor();
    // No style chosen for salt: the page says styles differ and suggests picking one.
    await reading
      .getByText(/^Salt per litre of milk differs a lot from one style to another/)
      .waitFor();
    await expect(page.getByRole('radio', { name: 'One batch' }).isChecked()).resolves.toBe(true);
    expect(new URL(page.url()).searchParams.has('per')).toBe(false);

    // Per tasting: the narrower interval, with the reason it is too narrow.
    await page.getByText('One tasting', { exact: true }).click();
    await page.waitForURL(/per=tasting/);
    await reading.getByText(/^Across 28 tastings of 7 batches/).waitFor();
    await reading.getByText(/\(95 % interval \+0\.16 to \+1\.3\)/).waitFor();
    await reading.getByText(/^The whole interval is above zero, but .* too narrow/).waitFor();
    await reading.getByText(/not independent/).waitFor();
    await reading.getByText(/pseudo-replication/).waitFor();
    await settle(page);
    await e.screenshot(page, 'compare-trial-per-tasting-desktop');

    // One style chosen: no style caution.
    await page.goto(`${e.baseUrl}/compare?x=saltPerLitre&y=overall&style=feta&maker=${handle}`);
    await reading.getByText(/^Across 3 batches of Feta/).waitFor();
    expect(await reading.getByText(/differs a lot from one style/).count()).toBe(0);
    expect(problems).toEqual([]);
  });

  it('shows the raw-milk caution beside heat treatment, and reads on a phone', async () => {
    const { page, problems } = await e.newPage(PHONE);
    await page.goto(`${e.baseUrl}/compare?x=heatTreatment&y=overall&maker=${handle}`);
    const reading = page.getByRole('region', { name: 'What the chart says' });
    await reading.getByText(/^Across/).waitFor();
    await settle(page);
    await e.screenshot(page, 'compare-trial-heat-phone');

    await reading.getByText(/the highest average overall liking was for raw/).waitFor();
    const caution = page.getByRole('note', { name: /Raw-milk cheese/ });
    await caution.getByText(/Listeria, E\. coli O157:H7, Salmonella/).waitFor();
    await caution.getByText(/say nothing about whether a cheese is safe/).waitFor();
    await caution.getByText(/local/).waitFor();
    await noSidewaysScroll(page);

    await page.goto(`${e.baseUrl}/compare?x=saltPerLitre&y=overall&maker=${handle}`);
    await reading.getByText(/^Across 7 batches/).waitFor();
    await noSidewaysScroll(page);
    await settle(page);
    await e.screenshot(page, 'compare-trial-default-phone');
    expect(problems).toEqual([]);
  });
});

import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { visitor } from '../support/app';
import { SCREENSHOT_DIR, startE2E, type E2E } from '../support/browser';
import { insertTastingRow } from '../support/community-factory';
import { createMember, signedIn } from '../support/factories';
import { insertJournalRow } from '../support/journal-rows';

const PHONE = { width: 390, height: 844 };

describe('what a maker sees of a moderator’s hide, in Chromium', () => {
  let e: E2E;
  beforeAll(async () => {
    e = await startE2E();
  });
  afterAll(() => e?.close());

  async function signIn(page: Page, email: string, password: string, next: string) {
    await e.browser.clearCookies();
    await page.goto(`${e.baseUrl}/signin?next=${encodeURIComponent(next)}`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === next);
  }

  async function hide(type: string, id: number, note: string) {
    const reporter = await signedIn(e.t.app, e.t.ctx);
    const mod = await signedIn(e.t.app, e.t.ctx, { role: 'moderator' });
    const filed = await reporter.post('/api/reports', {
      targetType: type,
      targetId: id,
      reason: 'other',
    });
    expect(filed.status).toBe(201);
    const acted = await mod.post(`/api/moderation/reports/${filed.body.report.id}/actions`, {
      action: 'hide',
      note,
    });
    expect(acted.status).toBe(200);
  }

  it('marks a hidden journal and tasting with the note on the journal page and in My journals', async () => {
    const maker = await createMember(e.t.ctx);
    const journalId = await insertJournalRow(e.t.ctx, maker.id, {
      title: 'Clothbound cheddar, June',
    });
    const tastingId = await insertTastingRow(e.t.ctx, journalId, maker.id, 8);
    await hide('tasting', tastingId, 'Scored before the wheel was opened.');
    await hide('journal', journalId, 'The notes link to a shop: please take the link out.');

    const { page, problems } = await e.newPage(PHONE);
    await signIn(page, maker.email, maker.password, `/journals/${journalId}`);
    const mark = page.getByRole('note').filter({ hasText: 'Hidden by a moderator' }).first();
    await mark.waitFor();
    await mark.getByText('The notes link to a shop: please take the link out.').waitFor();
    await mark.getByText(/Only a moderator can bring it back/).waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'hidden-mark-journal-phone.png') });
    await page.getByText('Scored before the wheel was opened.').scrollIntoViewIfNeeded();
    await page
      .getByRole('note')
      .filter({ hasText: 'Scored before the wheel was opened.' })
      .screenshot({ path: path.join(SCREENSHOT_DIR, 'hidden-mark-tasting-phone.png') });

    await page.goto(`${e.baseUrl}/journals/mine`);
    const card = page.getByRole('article').filter({ hasText: 'Clothbound cheddar, June' });
    await card.getByText('Hidden by a moderator').waitFor();
    await card.screenshot({ path: path.join(SCREENSHOT_DIR, 'hidden-mark-my-journals-phone.png') });

    // Anyone else still finds nothing there.
    const other = await visitor(e.t.app).get(`/api/journals/${journalId}`);
    expect(other.status).toBe(404);
    expect(problems).toEqual([]);
    await page.close();
  });
});

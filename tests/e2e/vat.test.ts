import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { JournalDto } from '../../shared/types/journal';
import { toNewtons } from '../../shared/trade/units';
import { SCREENSHOT_DIR, startE2E, type E2E } from '../support/browser';
import { documentFromDto } from '../../client/lib/vat/document';
import { visitor } from '../support/app';
import { createMember } from '../support/factories';
import { journalDocument, putJournal } from '../support/journal-factory';

const PHONE = { width: 390, height: 844 };

/** A make not yet made: the steps with targets only, the press schedule, no green weight. */
function makeDayDocument() {
  return journalDocument({
    title: 'Tuesday cheddar at the vat',
    status: 'published',
    visibility: 'public',
    wheelStatus: 'making',
    greenWeightKg: null,
    steps: [
      { kind: 'warming', targetTempC: 31, targetMinutes: 20 },
      { kind: 'cooking', targetTempC: 38, targetMinutes: 30, note: 'Raise it slowly.' },
      { kind: 'cheddaring', targetMinutes: 90 },
      { kind: 'pressing' },
    ],
    pressStages: [
      { loadN: toNewtons(10, 'lbf'), loadUnit: 'lbf', minutes: 15 },
      { loadN: toNewtons(50, 'lbf'), loadUnit: 'lbf', minutes: 12 * 60 },
    ],
  });
}

describe('At the vat in Chromium, on a phone', () => {
  let e: E2E;
  beforeAll(async () => {
    e = await startE2E();
    // One fake clock for the context, running from a known morning; fastForward moves it on
    // like a maker waiting at the vat.
    await e.browser.clock.install({ time: new Date('2026-03-14T09:00:00') });
  });
  afterAll(() => e?.close());

  async function signIn(page: Page, email: string, password: string) {
    await e.browser.setOffline(false);
    await e.browser.clearCookies();
    await page.goto(`${e.baseUrl}/signin`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Discover make journals' }).waitFor();
  }

  /** Calls the API from the page, with its session cookie and a CSRF token. */
  function api<T>(page: Page, method: string, path: string, body?: unknown): Promise<T> {
    return page.evaluate(
      async ({ method, path, body }) => {
        const { token } = await (await fetch('/api/auth/csrf')).json();
        const res = await fetch(path, {
          method,
          headers: { 'content-type': 'application/json', 'x-csrf-token': token },
          body: body === undefined ? undefined : JSON.stringify(body),
        });
        if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
        return res.json();
      },
      { method, path, body },
    ) as Promise<T>;
  }

  /** Taps a step or press button; the page ignores a second tap within 0.7 s (wet fingers). */
  async function tap(page: Page, name: string) {
    await page.waitForTimeout(800);
    await page.getByRole('button', { name }).click();
  }

  async function logTemperature(page: Page, value: string) {
    await page.getByLabel('Temperature (°F)').fill(value);
    await page.getByRole('button', { name: 'Log reading', exact: true }).click();
    await page.getByText(`Logged ${value} °F`).waitFor();
  }

  it('runs the make: a ramp warning, and readings kept through a lost connection, each once', async () => {
    const maker = await createMember(e.t.ctx, { units: 'us' });
    const { page, problems } = await e.newPage(PHONE);
    await signIn(page, maker.email, maker.password);
    const journal = await api<JournalDto>(page, 'POST', '/api/journals', makeDayDocument());

    await page.clock.setSystemTime(new Date('2026-03-14T09:00:00'));
    await page.goto(`${e.baseUrl}/journals/${journal.id}/vat`);
    await page.getByRole('heading', { name: 'Warming the milk' }).waitFor();
    await page.getByText('Step 1 of 4').waitFor();
    await page.getByText('87.8 °F').first().waitFor(); // 31 °C in the member's units
    await e.screenshot(page, 'vat-phone-start');

    await tap(page, 'Start warming the milk');
    await page.getByText('Step 1 of 4 · running').waitFor();
    await page.clock.fastForward('20:00');
    await page.getByText('over the target time').waitFor();
    await tap(page, 'Finish step');

    await page.getByRole('heading', { name: 'Cooking' }).waitFor();
    await tap(page, 'Start cooking');
    // A stirring reminder every 5 minutes.
    await page.getByRole('button', { name: 'Remind me: stir every 5 min' }).click();
    await page.getByText('Not stirred yet').waitFor();

    // Three readings rising 4 °F per 5 minutes: twice the common limit of 2 °F.
    await logTemperature(page, '88');
    await page.clock.fastForward('05:00');
    await page.getByText('Stir the curd now').waitFor();
    await page.getByRole('button', { name: 'Done: stir the curd' }).click();
    await page.getByText('Stirred once').waitFor();
    await logTemperature(page, '92');
    await page.clock.fastForward('05:00');
    await logTemperature(page, '96');
    // A strip that stays on screen while scrolling, and the full warning by the logger.
    await page
      .getByRole('alert')
      .filter({ hasText: 'Heating too fast: rising 4 °F per 5 min (limit 2 °F per 5 min)' })
      .waitFor();
    await page.getByRole('heading', { name: 'Heating too fast' }).waitFor();
    await page.getByText('Rising 4 °F per 5 min', { exact: true }).waitFor();
    await page.getByText('The limit is 2 °F per 5 min').waitFor();
    await e.screenshot(page, 'vat-phone-ramp-warning');

    await page.getByRole('button', { name: 'Done: stir the curd' }).click();
    await page.getByText('Stirred twice').waitFor();

    // What the maker sees at the top of the page: the step, the alert, a way to the logger.
    await page.evaluate(() => window.scrollTo(0, 0));
    const jump = page.getByRole('button', { name: 'Log reading ↓' });
    await jump.waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'vat-phone-viewport.png') });
    await jump.click();
    await jump.waitFor({ state: 'detached' });

    // The connection drops; a reading is kept on the phone and shown as waiting.
    await e.browser.setOffline(true);
    await page.getByText('Offline').first().waitFor();
    await page.clock.fastForward('05:00');
    await logTemperature(page, '97');
    await page.getByText('Offline — 1 reading waiting to send').waitFor();
    await page.getByText('waiting to send', { exact: true }).waitFor();
    await e.screenshot(page, 'vat-phone-offline');

    await e.browser.setOffline(false);
    await page.getByText('waiting to send', { exact: true }).waitFor({ state: 'detached' });
    await page.getByText(/Offline/).waitFor({ state: 'detached' });

    const stored = await api<JournalDto>(page, 'GET', `/api/journals/${journal.id}`);
    const temps = stored.readings.map((r) => r.tempC).sort((a, b) => a! - b!);
    expect(stored.readings).toHaveLength(4);
    expect(new Set(stored.readings.map((r) => r.id)).size).toBe(4);
    expect(temps.map((c) => Math.round((c! * 9) / 5 + 32))).toEqual([88, 92, 96, 97]);
    expect(stored.readings.every((r) => r.stepIndex === 1)).toBe(true);
    // The step times went back to the journal as they happened.
    expect(stored.steps[0].actualMinutes).toBe(20);
    const started = Date.parse(stored.steps[0].startedAt!) - Date.parse('2026-03-14T09:00:00');
    expect(started).toBeGreaterThanOrEqual(0);
    expect(started).toBeLessThan(10_000);
    expect(stored.steps[1].startedAt).not.toBeNull();
    expect(stored.steps[1].actualMinutes).toBeNull();

    // A reload comes back to the running step, with its time, and the same four readings.
    await page.reload();
    await page.getByText('Step 2 of 4 · running').waitFor();
    await page.getByRole('heading', { name: 'Readings (4)' }).waitFor();
    const again = await api<JournalDto>(page, 'GET', `/api/journals/${journal.id}`);
    expect(again.readings).toHaveLength(4);

    expect(problems.filter((p) => !p.includes('ERR_INTERNET_DISCONNECTED'))).toEqual([]);
    await page.close();
  });

  it('keeps the vat times when the journal was saved elsewhere meanwhile (409)', async () => {
    const maker = await createMember(e.t.ctx, { units: 'us' });
    const { page, problems } = await e.newPage(PHONE);
    await signIn(page, maker.email, maker.password);
    const journal = await api<JournalDto>(page, 'POST', '/api/journals', makeDayDocument());
    // The same maker on the laptop, signed in on their own.
    const laptop = visitor(e.t.app);
    await laptop.post('/api/auth/signin', { email: maker.email, password: maker.password });
    laptop.resetCsrf();
    const isPut =
      (status: number) =>
      (r: { url(): string; status(): number; request(): { method(): string } }) =>
        r.request().method() === 'PUT' &&
        r.url().endsWith(`/api/journals/${journal.id}`) &&
        r.status() === status;

    await page.clock.setSystemTime(new Date('2026-03-14T11:00:00'));
    await page.goto(`${e.baseUrl}/journals/${journal.id}/vat`);
    await page.getByRole('heading', { name: 'Warming the milk' }).waitFor();

    // The phone loses the connection and the maker starts warming: the update waits.
    await e.browser.setOffline(true);
    await page.getByText('Offline').first().waitFor();
    await tap(page, 'Start warming the milk');
    await page.getByText('Step 1 of 4 · running').waitFor();
    await page.getByText(/step times waiting to send/).waitFor();

    // Meanwhile the laptop saves: a note, and a start time typed for the same step.
    const onLaptop = documentFromDto(journal);
    onLaptop.notes = 'Milk from the Tuesday collection.';
    onLaptop.steps[0] = { ...onLaptop.steps[0], startedAt: '2026-03-14T10:40:00.000Z' };
    expect((await putJournal(laptop, journal.id, onLaptop, journal.version)).status).toBe(200);

    // Back online: the server refuses the stale update; the phone keeps it and asks.
    await e.browser.setOffline(false);
    const panel = page.getByRole('alert').filter({ hasText: 'changed somewhere else' });
    await panel.waitFor();
    await panel.getByText('Step 1: started at').waitFor();
    await panel.getByText('Also changed elsewhere, and kept alongside yours: Notes.').waitFor();
    await e.screenshot(page, 'vat-phone-conflict');
    // Reloading keeps the held update and asks again.
    await page.reload();
    await panel.waitFor();

    const kept = page.waitForResponse(isPut(200), { timeout: 15_000 });
    await panel.getByRole('button', { name: 'Keep mine and save' }).click();
    await kept;
    await panel.waitFor({ state: 'detached' });
    const stored = await api<JournalDto>(page, 'GET', `/api/journals/${journal.id}`);
    expect(stored.notes).toBe('Milk from the Tuesday collection.');
    expect(Date.parse(stored.steps[0].startedAt!)).toBeGreaterThanOrEqual(
      Date.parse('2026-03-14T11:00:00'),
    );

    expect(
      problems.filter(
        (p) => !p.includes('ERR_INTERNET_DISCONNECTED') && !p.includes('409') && !p.includes('403'),
      ),
    ).toEqual([]);
    await page.close();
  });

  it('runs the press schedule, asks for the green weight and lists the drying days', async () => {
    const maker = await createMember(e.t.ctx, { units: 'us' });
    const { page, problems } = await e.newPage(PHONE);
    await signIn(page, maker.email, maker.password);
    const journal = await api<JournalDto>(page, 'POST', '/api/journals', makeDayDocument());
    await page.clock.setSystemTime(new Date('2026-03-14T14:00:00'));
    await page.goto(`${e.baseUrl}/journals/${journal.id}/vat`);
    await page.getByRole('heading', { name: 'Warming the milk' }).waitFor();
    // A double tap with wet fingers logs one reading, not two.
    await page.getByLabel('Temperature (°F)').fill('70');
    await page.getByRole('button', { name: 'Log reading', exact: true }).dblclick();
    await page.getByText('Logged 70 °F').waitFor();
    await page.getByRole('heading', { name: 'Readings (1)' }).waitFor();
    for (const step of ['Warming the milk', 'Cooking', 'Cheddaring']) {
      await page.getByRole('heading', { name: step }).waitFor();
      await tap(page, 'Skip step →');
    }
    await page.getByRole('heading', { name: 'Pressing' }).waitFor();
    await page.getByText('0.995 psi · 6.86 kPa').first().waitFor(); // 50 lb on an 8-inch mould

    await tap(page, 'Start pressing: 10 lb');
    await page.getByText('Step 4 of 4 · running').waitFor();
    await page.getByRole('button', { name: 'Remind me: check every 30 min' }).click();
    await page.clock.fastForward('15:00');
    await e.screenshot(page, 'vat-phone-press');
    // Putting on the next weight ends the stage and starts the next one in the same tap.
    await tap(page, 'Next stage: 50 lb');
    await page.getByText('Stage 2 of 2').waitFor();
    await page.clock.fastForward('12:00:00');
    await tap(page, 'Finish pressing');

    await page.getByText('Every step is done').waitFor();
    await page.getByLabel('Weight off the press (lb)').fill('4.2');
    await page.getByRole('button', { name: 'Save the green weight' }).click();
    await page.getByText('Turn the wheel today (day 1 of 3)').waitFor();
    await page.getByText('4.2 lb').waitFor();
    await page.getByLabel(/Day 1/).check();
    await page.getByText('Turned today. Next turn tomorrow.').waitFor();
    await e.screenshot(page, 'vat-phone-drying');

    await page.waitForFunction(() => !document.body.innerText.includes('Waiting to send'));
    const stored = await api<JournalDto>(page, 'GET', `/api/journals/${journal.id}`);
    expect(stored.wheelStatus).toBe('drying');
    expect(stored.readings).toHaveLength(1);
    expect(stored.greenWeightKg).toBeCloseTo(4.2 * 0.45359237, 6);
    // The pressing step ran as long as the press: 15 min and 12 h (plus the test's own seconds).
    expect(stored.steps[3].actualMinutes).toBeCloseTo(15 + 12 * 60, 0);
    expect(problems).toEqual([]);
    await page.close();
  });

  it('tells another member that only the maker can use it', async () => {
    const maker = await createMember(e.t.ctx);
    const other = await createMember(e.t.ctx);
    const { page, problems } = await e.newPage(PHONE);
    await signIn(page, maker.email, maker.password);
    const journal = await api<JournalDto>(page, 'POST', '/api/journals', makeDayDocument());
    await signIn(page, other.email, other.password);
    await page.goto(`${e.baseUrl}/journals/${journal.id}/vat`);
    await page.getByRole('heading', { name: 'Only the maker can use At the vat' }).waitFor();
    await page.getByRole('button', { name: 'Read the journal' }).waitFor();
    expect(problems).toEqual([]);
    await page.close();
  });
});

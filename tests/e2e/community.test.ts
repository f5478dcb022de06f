import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import { and, eq, ne } from 'drizzle-orm';
import { reports } from '../../server/db/schema';
import { refreshJournalTastingStats } from '../../server/repositories/tastings.repository';
import { SCREENSHOT_DIR, startE2E, type E2E } from '../support/browser';
import {
  insertCommentRow,
  insertTastingRow,
  makeSeasoned,
  setBio,
} from '../support/community-factory';
import { createMember } from '../support/factories';
import { insertJournalRow } from '../support/journal-rows';

const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1280, height: 900 };
type Member = Awaited<ReturnType<typeof createMember>>;

/** Waits until the locator shows the text (playwright-core has no expect of its own). */
/** A picture of one part of the page (the whole page is too long to read on a phone). */
const shot = (where: Locator, name: string) =>
  where.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`) });

const shows = (where: Locator, text: string | RegExp) =>
  where.filter({ hasText: text }).first().waitFor();

// Every way we know to run script from Markdown or HTML: each one, if it ran, would set a
// window flag or open a dialog.
const XSS = [
  '<script>window.__xss = "script"; alert("script")</script>',
  "<img src=x onerror=\"window.__xss='img'; alert('img')\">",
  '"><img src=x onerror=alert("attr")>',
  '<svg onload="window.__xss=\'svg\'"><circle r="5"/></svg>',
  '<svg><script>window.__xss="svg-script"</script></svg>',
  '<iframe src="javascript:window.parent.__xss=\'iframe\'"></iframe>',
  '<details open ontoggle="window.__xss=\'details\'">x</details>',
  '<math><mtext><table><mglyph><style><img src=x onerror="window.__xss=\'mxss\'">',
  '<a href="javascript:window.__xss=\'a\'">raw link</a>',
  '[md link](javascript:window.__xss="md")',
  '[mixed case](JaVaScRiPt:window.__xss="case")',
  '[entity](&#106;avascript:window.__xss="entity")',
  '[spaced]( javascript:window.__xss="spaced")',
  '<javascript:window.__xss="autolink">',
  '[vb](vbscript:msgbox(1))',
  '[data html](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==)',
  '![data svg](data:image/svg+xml;base64,PHN2ZyBvbmxvYWQ9YWxlcnQoMSk+PC9zdmc+)',
  '![pixel](https://example.test/track.gif)',
  '<style>body{display:none}</style>',
  '<form action="javascript:alert(1)"><button>go</button></form>',
].join('\n\n');

describe('community in Chromium', () => {
  let e: E2E;
  beforeAll(async () => {
    e = await startE2E();
  });
  afterAll(() => e?.close());

  async function signIn(page: Page, member: Member, next: string) {
    await e.browser.clearCookies();
    await page.goto(`${e.baseUrl}/signin?next=${encodeURIComponent(next)}`);
    await page.getByLabel('E-mail').fill(member.email);
    await page.getByLabel('Password').fill(member.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === next.split('#')[0]);
  }

  /** Fails on anything in the page that could run script, and on any dialog or flag. */
  async function expectInert(page: Page, container: string, dialogs: string[]) {
    const html = await page
      .locator(container)
      .evaluateAll((nodes) => nodes.map((n) => n.innerHTML).join('\n'));
    expect(html.length).toBeGreaterThan(0);
    expect(html).not.toMatch(/<[a-z][^>]*\son[a-z]+\s*=/i);
    expect(html).not.toMatch(
      /<[a-z][^>]*\s(href|src|action)\s*=\s*["']?\s*(javascript|vbscript|data):/i,
    );
    expect(html).not.toMatch(/<(script|svg|math|iframe|img|style|form|button)\b/i);
    const found = await page.evaluate(
      (sel) =>
        [...document.querySelectorAll(`${sel} *`)].flatMap((el) =>
          [...el.attributes]
            .filter(
              (a) =>
                a.name.startsWith('on') ||
                /^\s*(javascript|vbscript|data):/i.test(a.value) ||
                a.name === 'srcdoc',
            )
            .map((a) => `${el.tagName}.${a.name}`),
        ),
      container,
    );
    expect(found).toEqual([]);
    expect(
      await page.evaluate(() => (window as unknown as { __xss?: string }).__xss),
    ).toBeUndefined();
    expect(dialogs).toEqual([]);
  }

  it('renders an XSS corpus in a bio and in comments without running any of it', async () => {
    const maker = await createMember(e.t.ctx);
    await setBio(e.t.ctx, maker.id, `Makes **tommes**.\n\n${XSS}`);
    const journalId = await insertJournalRow(e.t.ctx, maker.id, { title: 'Tomme under test' });
    await insertTastingRow(e.t.ctx, journalId, maker.id, 7);
    await refreshJournalTastingStats(e.t.ctx.database.db, journalId);
    const commenter = await createMember(e.t.ctx);
    const top = await insertCommentRow(e.t.ctx, journalId, commenter.id, { body: XSS });
    await insertCommentRow(e.t.ctx, journalId, maker.id, { body: XSS, parentId: top });

    const { page, problems } = await e.newPage(DESKTOP);
    const dialogs: string[] = [];
    page.on('dialog', (d) => {
      dialogs.push(d.message());
      void d.dismiss();
    });
    await page.goto(`${e.baseUrl}/@${maker.handle}`);
    await page.getByRole('heading', { name: maker.displayName }).waitFor();
    await shows(page.locator('.bio'), 'Makes tommes.');
    await expectInert(page, '.bio', dialogs);
    await e.screenshot(page, 'community-profile-xss-desktop');

    await page.goto(`${e.baseUrl}/journals/${journalId}`);
    await page.getByRole('heading', { name: /Conversation/ }).waitFor();
    await page.locator('.comment .body').nth(1).waitFor();
    expect(await page.locator('.comment .body').count()).toBe(2);
    // The payloads are there as text a reader can see, not as markup.
    await shows(page.locator('.comment .body').first(), '<script>window.__xss');
    await expectInert(page, '.comment .body', dialogs);
    // Links that survived are ordinary, marked nofollow.
    const rels = await page
      .locator('.comment .body a')
      .evaluateAll((as) => as.map((a) => `${a.getAttribute('href')} ${a.getAttribute('rel')}`));
    for (const rel of rels) expect(rel).toMatch(/^https?:\/\/\S+ nofollow noopener$/);
    expect(
      problems.filter((p) => !/Content Security Policy|Failed to load resource/.test(p)),
    ).toEqual([]);
  });

  it('a reader comments, the owner is notified, a third member reports it, a moderator hides it: gone for all but its author and the moderators', async () => {
    const owner = await createMember(e.t.ctx);
    const reader = await createMember(e.t.ctx);
    const third = await createMember(e.t.ctx);
    const moderator = await createMember(e.t.ctx, { role: 'moderator' });
    // Never held for review, even if a test elsewhere switched that on just now.
    await makeSeasoned(e.t.ctx, reader.id);
    const title = `Harbour clothbound ${owner.handle.slice(-5)}`;
    const journalId = await insertJournalRow(e.t.ctx, owner.id, { title });
    await setBio(e.t.ctx, owner.id, 'Clothbound cheddars from the **east lane** dairy.');
    const journalPath = `/journals/${journalId}`;
    const words = `Did you bandage with lard or butter? ${reader.handle.slice(-5)}`;

    // The reader comments, on a phone.
    const { page, problems } = await e.newPage(PHONE);
    await signIn(page, reader, journalPath);
    await page.getByRole('heading', { name: title }).waitFor();
    await page.getByLabel('Add to the conversation').fill(words);
    await page.getByRole('button', { name: 'Post the comment' }).click();
    await page.getByText('Comment posted.').waitFor();
    const comment = page.getByRole('article', { name: `Comment by ${reader.displayName}` }).last();
    await shows(comment, words);
    await shot(page.locator('.conversation'), 'community-comments-phone');

    // The owner sees the mark in the header, the notification, and lands on the comment.
    await page.setViewportSize(DESKTOP);
    await signIn(page, owner, '/');
    const bell = page.getByRole('link', { name: 'Notifications, 1 unread' });
    await bell.waitFor();
    await bell.click();
    const notice = page.getByRole('button', {
      name: `Unread: ${reader.displayName} commented on “${title}”`,
    });
    await notice.waitFor();
    await shows(page.locator('.list'), words);
    await e.screenshot(page, 'community-notifications-desktop');
    await notice.click();
    await page.waitForURL(`**${journalPath}#comment-*`);
    await shows(page.getByRole('article', { name: `Comment by ${reader.displayName}` }), words);
    await page.getByRole('link', { name: 'Notifications' }).waitFor();
    // The owner answers in the thread.
    const answer = 'Lard, two coats, then cloth.';
    await page
      .getByRole('article', { name: `Comment by ${reader.displayName}` })
      .getByRole('button', { name: 'Reply' })
      .click();
    await page.getByLabel(`Reply to ${reader.displayName}`).fill(answer);
    await page.getByRole('button', { name: 'Post the reply' }).click();
    await shows(page.getByRole('article', { name: `Comment by ${owner.displayName}` }), answer);
    await shot(page.locator('.conversation'), 'community-comments-desktop');

    // A third member reports it.
    await signIn(page, third, journalPath);
    const seen = page.getByRole('article', { name: `Comment by ${reader.displayName}` });
    await shows(seen, words);
    await seen.getByRole('button', { name: 'Report this comment' }).click();
    await page.getByRole('button', { name: 'Send the report' }).click();
    await page.getByText('Choose a reason.').waitFor();
    await page.locator('.n-radio').filter({ hasText: 'Rude, hateful or abusive' }).click();
    await page
      .getByLabel('Anything the moderators should know (optional)')
      .fill('Rude to the maker.');
    await page.getByRole('button', { name: 'Send the report' }).click();
    await page.getByText('Thank you. A moderator will look at it soon.').waitFor();

    // The queue shows the oldest open reports first; the API tests share this database and
    // leave open reports of their own, so close those to keep this one on the first page.
    await e.t.ctx.database.db
      .update(reports)
      .set({ status: 'dismissed' })
      .where(and(eq(reports.status, 'open'), ne(reports.reporterId, third.id)));

    // A moderator hides it from the queue, on a phone first, with a note to its author.
    await page.setViewportSize(PHONE);
    await signIn(page, moderator, '/admin');
    await page.getByRole('heading', { name: 'Running the site' }).waitFor();
    const card = page.getByRole('article', { name: /^Report \d+:/ }).filter({ hasText: words });
    await card.waitFor();
    await shows(card, 'Rude, hateful or abusive');
    await shows(card, `@${third.handle}`);
    await e.screenshot(page, 'community-moderation-phone');
    await page.setViewportSize(DESKTOP);
    await card.getByRole('button', { name: /^History/ }).click();
    await e.screenshot(page, 'community-moderation-desktop');
    await card
      .getByLabel('Note to the author and the log (optional)')
      .fill('Please keep it civil.');
    await card.getByRole('button', { name: 'Hide', exact: true }).click();
    await page.getByText('Hidden. Its author has your note.').waitFor();
    await card.getByRole('button', { name: 'Restore' }).waitFor();

    // Gone for visitors, the third member and the owner; still there for author and moderator.
    const commentCount = async () => {
      await page.getByRole('heading', { name: /^Conversation/ }).waitFor();
      await page.getByRole('button', { name: 'Print make sheet' }).waitFor();
      await page.locator('.conversation [aria-busy="true"]').waitFor({ state: 'detached' });
      return page.getByText(words).count();
    };
    await e.browser.clearCookies();
    await page.goto(`${e.baseUrl}${journalPath}`);
    expect(await commentCount()).toBe(0);
    // The owner's reply stays, under a placeholder that says nothing of what was hidden.
    await page.getByText('This comment is no longer here.').waitFor();
    await page.getByText('Lard, two coats, then cloth.').waitFor();
    for (const who of [third, owner]) {
      await signIn(page, who, journalPath);
      expect(await commentCount(), who.handle).toBe(0);
    }
    await signIn(page, reader, journalPath);
    expect(await commentCount()).toBe(1);
    // The author sees the moderator's mark on their comment, with the note and what they can do.
    const mark = page.locator('.conversation .hidden-mark');
    await mark.getByText('Hidden by a moderator').waitFor();
    await mark.getByText('Please keep it civil.').waitFor();
    await mark.getByText(/Only you and the moderators see it\. You can delete it/).waitFor();
    await page.setViewportSize(PHONE);
    await shot(page.locator('.conversation'), 'community-comments-hidden-phone');
    await page.setViewportSize(DESKTOP);
    await signIn(page, moderator, journalPath);
    expect(await commentCount()).toBe(1);
    await signIn(page, reader, '/notifications');
    await page.getByText('Note: Please keep it civil.').waitFor();

    // The owner's profile, as a visitor sees it.
    await e.browser.clearCookies();
    await page.goto(`${e.baseUrl}/@${owner.handle}`);
    await page.getByRole('heading', { name: owner.displayName }).waitFor();
    await page.getByRole('button', { name: `Follow ${owner.displayName}` }).waitFor();
    await e.screenshot(page, 'community-profile-desktop');
    await page.setViewportSize(PHONE);
    await e.screenshot(page, 'community-profile-phone');
    // Signed-out pages answer 401 to the session probe only; a report's 409s never happen here.
    expect(problems.filter((p) => !p.includes('status of 401'))).toEqual([]);
  });
});

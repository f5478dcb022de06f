import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { createServer, type Server } from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { createTestApp, type TestApp } from './app';

export const SCREENSHOT_DIR = path.resolve(
  path.dirname(fileURLToPath(import.meta.url)),
  '../e2e/screenshots',
);

export type E2E = {
  t: TestApp;
  baseUrl: string;
  browser: BrowserContext;
  /** A new page that records console errors and failed requests. */
  newPage: (viewport?: {
    width: number;
    height: number;
  }) => Promise<{ page: Page; problems: string[] }>;
  screenshot: (page: Page, name: string) => Promise<string>;
  close: () => Promise<void>;
};

/**
 * The real app serving the built client on a free loopback port, and Debian's Chromium
 * driven by playwright-core with a fresh temporary profile (never a downloaded browser).
 */
export async function startE2E(): Promise<E2E> {
  const t = await createTestApp({ SERVE_CLIENT: 'true' });
  const server: Server = createServer(t.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  // Links in mails must point at this server.
  t.ctx.config = { ...t.ctx.config, publicUrl: baseUrl };

  const profile = mkdtempSync(path.join(os.tmpdir(), 'rindwise-chromium-'));
  const browser = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
    viewport: { width: 1280, height: 900 },
  });
  mkdirSync(SCREENSHOT_DIR, { recursive: true });

  return {
    t,
    baseUrl,
    browser,
    newPage: async (viewport) => {
      const page = await browser.newPage();
      if (viewport) await page.setViewportSize(viewport);
      const problems: string[] = [];
      page.on('console', (msg) => {
        if (msg.type() === 'error') problems.push(`console: ${msg.text()}`);
      });
      page.on('pageerror', (err) => problems.push(`page error: ${err.message}`));
      return { page, problems };
    },
    screenshot: async (page, name) => {
      const file = path.join(SCREENSHOT_DIR, `${name}.png`);
      await page.screenshot({ path: file, fullPage: true });
      return file;
    },
    close: async () => {
      await browser.close();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await t.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

// Page metrics in headless Chromium (Debian's, through playwright-core): Largest Contentful
// Paint and Cumulative Layout Shift from the web-vitals package, and the JavaScript a page
// loads, each page opened cold (a fresh browser context) a few times in each viewport (a
// desktop window and a phone, as at the vat); the median is kept, with the spread of the runs.
import { mkdirSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium } from 'playwright-core';

export type Viewport = {
  name: string;
  width: number;
  height: number;
  deviceScaleFactor?: number;
  isMobile?: boolean;
};

export const VIEWPORTS: Viewport[] = [
  { name: 'desktop', width: 1280, height: 900 },
  { name: 'phone', width: 390, height: 844, deviceScaleFactor: 2, isMobile: true },
];

export type PageResult = {
  name: string;
  path: string;
  viewport: string;
  lcpMs: number;
  cls: number;
  /** Every run's figure, to show the noise around the median. */
  lcpRuns: number[];
  clsRuns: number[];
  /** What web-vitals' attribution build names: the LCP element and the largest shift's. */
  lcpElement: string;
  shiftTarget: string;
  scripts: number;
  jsBytes: number;
  jsBytesOnWire: number;
  jsEncodings: string[];
  /**
   * Where the LCP's time went (medians, ms after navigation): the first byte of the HTML, the
   * end of the last script and of the last API answer that arrived before the LCP, and the
   * LCP itself. The gap after the last of them is rendering.
   */
  lcpParts: { ttfb: number; scriptsDone: number; apiDone: number };
};

// The package's exports map leaves the IIFE build out, so it is found by its path.
const WEB_VITALS = path.resolve(
  path.dirname(fileURLToPath(import.meta.url)),
  '../node_modules/web-vitals/dist/web-vitals.attribution.iife.js',
);

export type MeasureOptions = { runs?: number; viewports?: Viewport[]; screenshots?: string };

const median = (values: number[]) =>
  [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

/**
 * Measures each page `runs` times, cold, in each viewport; resolves with the medians. With
 * `screenshots`, the first run of each page and viewport leaves a PNG of the viewport there.
 */
export async function measurePages(
  baseUrl: string,
  pages: { name: string; path: string }[],
  { runs = 3, viewports = VIEWPORTS, screenshots }: MeasureOptions = {},
): Promise<PageResult[]> {
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--no-first-run',
      '--disable-background-networking',
    ],
  });
  const results: PageResult[] = [];
  try {
    for (const target of pages) {
      for (const vp of viewports) {
        const samples: Omit<PageResult, 'name' | 'path' | 'viewport' | 'lcpRuns' | 'clsRuns'>[] =
          [];
        for (let run = 0; run < runs; run++) {
          const context = await browser.newContext({
            viewport: { width: vp.width, height: vp.height },
            deviceScaleFactor: vp.deviceScaleFactor ?? 1,
            isMobile: vp.isMobile ?? false,
            hasTouch: vp.isMobile ?? false,
            bypassCSP: true,
          });
          const page = await context.newPage();
          const scripts: Promise<{ bytes: number; wire: number; encoding: string } | null>[] = [];
          page.on('response', (response) => {
            if (response.request().resourceType() !== 'script') return;
            scripts.push(
              response.body().then(
                (body) => {
                  const headers = response.headers();
                  const encoding = headers['content-encoding'] ?? 'identity';
                  const wire = Number(headers['content-length'] ?? body.length);
                  return { bytes: body.length, wire, encoding };
                },
                () => null,
              ), // a script still loading when the context closes is not counted
            );
          });
          await page.goto(baseUrl + target.path, { waitUntil: 'load' });
          // After the load: web-vitals observes with `buffered: true`, so it still sees every
          // entry since navigation. The tag is inline, hence bypassCSP on this context only.
          await page.addScriptTag({ path: WEB_VITALS });
          await page.evaluate(() => {
            const w = window as unknown as {
              webVitals: {
                onLCP: (cb: (m: Metric) => void, o: object) => void;
                onCLS: (cb: (m: Metric) => void, o: object) => void;
              };
              __vitals: Vitals;
            };
            type Metric = { value: number; attribution?: Record<string, unknown> };
            type Vitals = {
              lcp: number | null;
              cls: number;
              lcpElement: string;
              shiftTarget: string;
            };
            w.__vitals = { lcp: null, cls: 0, lcpElement: '', shiftTarget: '' };
            w.webVitals.onLCP(
              (m) => {
                w.__vitals.lcp = m.value;
                w.__vitals.lcpElement = String(m.attribution?.target ?? '');
              },
              { reportAllChanges: true },
            );
            w.webVitals.onCLS(
              (m) => {
                w.__vitals.cls = m.value;
                w.__vitals.shiftTarget = String(m.attribution?.largestShiftTarget ?? '');
              },
              { reportAllChanges: true },
            );
          });
          await page.waitForLoadState('networkidle');
          await page.waitForTimeout(1000);
          const vitals = await page.evaluate(
            () =>
              (
                window as unknown as {
                  __vitals: {
                    lcp: number | null;
                    cls: number;
                    lcpElement: string;
                    shiftTarget: string;
                  };
                }
              ).__vitals,
          );
          const lcpAt = vitals.lcp ?? Number.POSITIVE_INFINITY;
          // A string, not a function: tsx would wrap a named inner function in a helper the page
          // does not have.
          const parts = (await page.evaluate(`(() => {
            const before = ${lcpAt};
            const nav = performance.getEntriesByType('navigation')[0];
            const ends = { script: 0, api: 0 };
            for (const r of performance.getEntriesByType('resource')) {
              if (r.responseEnd > before) continue;
              if (r.initiatorType === 'script' || /\\.js$/.test(r.name))
                ends.script = Math.max(ends.script, r.responseEnd);
              if (r.name.includes('/api/')) ends.api = Math.max(ends.api, r.responseEnd);
            }
            return { ttfb: nav ? nav.responseStart : 0, scriptsDone: ends.script, apiDone: ends.api };
          })()`)) as PageResult['lcpParts'];
          if (screenshots && run === 0) {
            mkdirSync(screenshots, { recursive: true });
            const slug = target.name.toLowerCase().replace(/[^a-z0-9]+/g, '-');
            await page.screenshot({
              path: path.join(screenshots, `${slug}-${vp.name}.png`),
            });
          }
          const loaded = (await Promise.all(scripts)).filter((s) => s !== null);
          samples.push({
            lcpMs: vitals.lcp ?? Number.NaN,
            cls: vitals.cls,
            lcpElement: vitals.lcpElement,
            shiftTarget: vitals.shiftTarget,
            scripts: loaded.length,
            jsBytes: loaded.reduce((sum, s) => sum + s.bytes, 0),
            jsBytesOnWire: loaded.reduce((sum, s) => sum + s.wire, 0),
            jsEncodings: [...new Set(loaded.map((s) => s.encoding))],
            lcpParts: parts,
          });
          await context.close();
        }
        results.push({
          name: target.name,
          path: target.path,
          viewport: vp.name,
          lcpMs: median(samples.map((s) => s.lcpMs)),
          cls: median(samples.map((s) => s.cls)),
          lcpRuns: samples.map((s) => Math.round(s.lcpMs)),
          clsRuns: samples.map((s) => Number(s.cls.toFixed(4))),
          lcpElement: samples[0].lcpElement,
          shiftTarget: samples[0].shiftTarget,
          scripts: median(samples.map((s) => s.scripts)),
          jsBytes: median(samples.map((s) => s.jsBytes)),
          jsBytesOnWire: median(samples.map((s) => s.jsBytesOnWire)),
          jsEncodings: samples[0].jsEncodings,
          lcpParts: {
            ttfb: Math.round(median(samples.map((s) => s.lcpParts.ttfb))),
            scriptsDone: Math.round(median(samples.map((s) => s.lcpParts.scriptsDone))),
            apiDone: Math.round(median(samples.map((s) => s.lcpParts.apiDone))),
          },
        });
      }
    }
  } finally {
    await browser.close();
  }
  return results;
}

/** The JavaScript files of the client build and their total size (to compare with a page's). */
export function buildScripts(dist: string): { files: number; bytes: number } {
  const dir = path.join(dist, 'assets');
  const files = readdirSync(dir).filter((f) => f.endsWith('.js'));
  return {
    files: files.length,
    bytes: files.reduce((s, f) => s + statSync(path.join(dir, f)).size, 0),
  };
}

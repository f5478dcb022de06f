// @vitest-environment happy-dom
import { effectScope } from 'vue';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { useVatJournal } from '../../../client/composables/useVatJournal';
import { OUTBOX_KEY } from '../../../client/composables/useReadingQueue';
import { applyStepTimer } from '../../../client/lib/vat/document';
import { createTimer, start } from '../../../client/lib/vat/timer';
import type { ReadingDto } from '../../../shared/types/journal';
import { journalDto } from './fixtures';

/** The journal routes as the vat uses them, in memory: readings stored once by id. */
function fakeApi(journal = journalDto()) {
  const readings = new Map<string, ReadingDto>();
  const puts: unknown[] = [];
  let reachable = true;
  const json = (status: number, body: unknown) =>
    new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
  const fetchMock = vi.fn(async (url: string, init: RequestInit = {}) => {
    if (!reachable) throw new TypeError('Failed to fetch');
    const method = init.method ?? 'GET';
    if (url === '/api/auth/csrf') return json(200, { token: 't' });
    if (method === 'GET' && url === `/api/journals/${journal.id}`)
      return json(200, { ...journal, readings: [...readings.values()] });
    if (method === 'PUT') {
      puts.push(JSON.parse(String(init.body)));
      return json(200, { ...journal, readings: [...readings.values()] });
    }
    if (method === 'POST' && url.endsWith('/readings')) {
      const r = JSON.parse(String(init.body)) as ReadingDto;
      const fresh = !readings.has(r.id);
      if (fresh) readings.set(r.id, r);
      return json(fresh ? 201 : 200, readings.get(r.id));
    }
    if (method === 'POST' && url.endsWith('/readings/batch')) {
      const list = (JSON.parse(String(init.body)) as { readings: ReadingDto[] }).readings;
      let created = 0;
      for (const r of list) if (!readings.has(r.id) && ++created) readings.set(r.id, r);
      return json(created ? 201 : 200, { readings: list.map((r) => readings.get(r.id)), created });
    }
    return json(404, { error: { code: 'NOT_FOUND', message: 'no' } });
  });
  return { fetchMock, readings, puts, setReachable: (v: boolean) => (reachable = v) };
}

let online = true;
const flush = () => new Promise((r) => setTimeout(r, 0));

describe('a journal at the vat, through the browser queue', () => {
  beforeEach(() => {
    localStorage.clear();
    online = true;
    Object.defineProperty(navigator, 'onLine', { configurable: true, get: () => online });
  });
  afterEach(() => vi.unstubAllGlobals());

  async function open(api: ReturnType<typeof fakeApi>) {
    vi.stubGlobal('fetch', api.fetchMock);
    const scope = effectScope();
    const vat = scope.run(() => useVatJournal(12))!;
    for (let i = 0; i < 5 && vat.state.value === 'loading'; i++) await flush();
    return { vat, scope };
  }

  it('keeps readings logged offline, sends them on the online event, and lists each once', async () => {
    const api = fakeApi();
    const { vat, scope } = await open(api);
    expect(vat.state.value).toBe('ready');

    online = false;
    window.dispatchEvent(new Event('offline'));
    vat.logReading({ tempC: 31, ph: null, stepIndex: 0 });
    vat.logReading({ tempC: 31.6, ph: 6.6, stepIndex: 0 });
    await flush();
    expect(api.readings.size).toBe(0);
    expect(vat.queue.online.value).toBe(false);
    expect(vat.waiting.value).toEqual({ readings: 2, updates: 0 });
    expect(vat.readings.value.map((r) => r.pending)).toEqual([true, true]);
    expect(JSON.parse(localStorage.getItem(OUTBOX_KEY)!)).toHaveLength(2);

    online = true;
    window.dispatchEvent(new Event('online'));
    for (let i = 0; i < 10 && vat.waiting.value.readings; i++) await flush();
    expect(api.readings.size).toBe(2);
    expect(vat.waiting.value).toEqual({ readings: 0, updates: 0 });
    expect(vat.readings.value).toHaveLength(2);
    expect(vat.readings.value.every((r) => !r.pending)).toBe(true);
    scope.stop();
  });

  it('after a reload, sends what the last page left and starts from the queued document', async () => {
    const api = fakeApi();
    const first = await open(api);
    api.setReachable(false);
    const doc = applyStepTimer(
      first.vat.doc.value!,
      start(createTimer(3), Date.now()),
      [],
      Date.now(),
    );
    expect(first.vat.saveDocument(doc)).toBeNull();
    first.vat.logReading({ tempC: 30.5, ph: null, stepIndex: 0 });
    await flush();
    first.scope.stop(); // the page is closed with both still queued

    api.setReachable(true);
    const second = await open(api);
    // The step start is not lost: the queued document is newer than the server's.
    expect(second.vat.doc.value!.steps[0].startedAt).toBe(doc.steps[0].startedAt);
    for (
      let i = 0;
      i < 10 && (second.vat.waiting.value.readings || second.vat.waiting.value.updates);
      i++
    )
      await flush();
    expect(api.readings.size).toBe(1);
    expect(api.puts).toHaveLength(1);
    expect(second.vat.readings.value).toHaveLength(1);
    second.scope.stop();
  });

  it('refuses a journal the member cannot edit', async () => {
    const api = fakeApi(journalDto({ canEdit: false }));
    const { vat, scope } = await open(api);
    expect(vat.state.value).toBe('not-yours');
    scope.stop();
  });

  it('says when the journal cannot be reached', async () => {
    const api = fakeApi();
    api.setReachable(false);
    const { vat, scope } = await open(api);
    expect(vat.state.value).toBe('offline');
    scope.stop();
  });
});

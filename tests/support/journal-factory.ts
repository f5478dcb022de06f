// Valid journal documents for tests (and for anyone who needs a realistic batch): the shape
// journalInputSchema takes, every value in SI, with the US amounts a home maker would type.
import type { JournalInputDraft } from '../../shared/schemas/journal';
import { toKilograms, toLitres, toMillimetres, toNewtons } from '../../shared/trade/units';
import type { Visitor } from './app';
import { unique } from './factories';

type Overrides = Partial<Omit<JournalInputDraft, 'milk' | 'mould' | 'aging'>> & {
  milk?: Partial<JournalInputDraft['milk']>;
  mould?: Partial<NonNullable<JournalInputDraft['mould']>>;
  aging?: Partial<NonNullable<JournalInputDraft['aging']>>;
};

/**
 * A farmhouse cheddar from 4 US gallons of cow's milk: culture, calcium chloride, annatto in
 * drops, rennet and salt; the trade's steps with target and actual temperatures; a rising
 * press schedule on an 8-inch round mould (50 lbf at the top); green weight 4 lb.
 * Private draft unless overridden.
 */
export function journalDocument(overrides: Overrides = {}): JournalInputDraft {
  const base: JournalInputDraft = {
    title: `Farmhouse cheddar ${unique()}`,
    styleSlug: 'cheddar',
    makeDate: '2026-01-10',
    status: 'draft',
    visibility: 'private',
    wheelStatus: 'aging',
    milk: {
      volumeL: toLitres(4, 'gal'),
      volumeUnit: 'gal',
      species: 'cow',
      heatTreatment: 'pasteurised',
      homogenised: false,
      fatPercent: 3.6,
      proteinPercent: 3.2,
    },
    mould: {
      shape: 'round',
      diameterMm: toMillimetres(8, 'in'),
      lengthMm: null,
      widthMm: null,
      unit: 'in',
    },
    rindTreatment: 'waxed',
    dryingDays: 3,
    aging: { targetDays: 90, tempC: 12, humidityPercent: 85, checkDate: null },
    greenWeightKg: toKilograms(4, 'lb'),
    notes: 'Cheddared for **90 minutes** until the curd tore like cooked chicken.',
    ingredients: [
      { kind: 'culture', name: 'Mesophilic starter', amount: 2, unit: 'g', mlPerDrop: null },
      { kind: 'calcium-chloride', name: 'Calcium chloride 30 %', amount: 1, unit: 'tsp' },
      { kind: 'colouring', name: 'Annatto', amount: 8, unit: 'drop', mlPerDrop: 0.05 },
      { kind: 'rennet', name: 'Calf rennet', amount: 0.75, unit: 'tsp' },
      { kind: 'salt', name: 'Flake salt', amount: 1, unit: 'oz', note: 'milled curd' },
    ],
    steps: [
      { kind: 'warming', targetTempC: 31, actualTempC: 31.2, targetMinutes: 20 },
      { kind: 'ripening', targetTempC: 31, actualTempC: 31, targetMinutes: 45, actualMinutes: 45 },
      { kind: 'coagulation', targetTempC: 31, actualTempC: 31.5, targetMinutes: 40 },
      { kind: 'cutting', cutSizeMm: 10 },
      { kind: 'cooking', targetTempC: 38, actualTempC: 38.5, targetMinutes: 30 },
      { kind: 'cheddaring', targetMinutes: 90, actualMinutes: 95 },
      { kind: 'milling' },
      { kind: 'salting' },
      { kind: 'pressing' },
    ],
    pressStages: [
      { loadN: toNewtons(10, 'lbf'), loadUnit: 'lbf', minutes: 15 },
      { loadN: toNewtons(25, 'lbf'), loadUnit: 'lbf', minutes: 30 },
      { loadN: toNewtons(50, 'lbf'), loadUnit: 'lbf', minutes: 12 * 60 },
    ],
    weighIns: [],
  };
  return {
    ...base,
    ...overrides,
    milk: { ...base.milk, ...overrides.milk },
    mould: { ...base.mould!, ...overrides.mould },
    aging: { ...base.aging!, ...overrides.aging },
  };
}

/** The same document, published and public (the caller must be verified to save it). */
export function publicJournalDocument(overrides: Overrides = {}): JournalInputDraft {
  return journalDocument({ status: 'published', visibility: 'public', ...overrides });
}

/** Saves a journal through the API as the signed-in visitor; resolves with its JournalDto. */
export async function postJournal(v: Visitor, overrides: Overrides = {}) {
  const res = await v.post('/api/journals', journalDocument(overrides));
  if (res.status !== 201) {
    throw new Error(`creating a journal failed: ${res.status} ${JSON.stringify(res.body)}`);
  }
  return res.body;
}

/** Awaits a request and checks its status, with the body in the message when it differs. */
export async function expectStatus<R extends { status: number; body: unknown }>(
  request: PromiseLike<R>,
  status: number,
): Promise<R> {
  const res = await request;
  if (res.status !== status) {
    throw new Error(`expected ${status}, got ${res.status}: ${JSON.stringify(res.body)}`);
  }
  return res;
}

/**
 * PUTs a whole document as the signed-in visitor with If-Match set to `version` (left out
 * when undefined), as the editor and the vat do.
 */
export async function putJournal(v: Visitor, id: number, doc: object, version: string | undefined) {
  const token = await v.csrf();
  const req = v.agent.put(`/api/journals/${id}`).set('x-csrf-token', token);
  if (version !== undefined) req.set('If-Match', version);
  return req.send(doc);
}

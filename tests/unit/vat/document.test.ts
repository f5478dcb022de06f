import { describe, expect, it } from 'vitest';
import {
  advanceWheel,
  applyGreenWeight,
  applyStepTimer,
  checkDocument,
  documentFromDto,
  lastTempOfStep,
} from '../../../client/lib/vat/document';
import { dryingPlan, toggleTurned } from '../../../client/lib/vat/drying';
import { formatClock, formatMinutes } from '../../../client/lib/vat/format';
import { faceOfMould, pressRows } from '../../../client/lib/vat/press';
import {
  isoWithOffset,
  makeReading,
  mergeReadings,
  newReadingId,
} from '../../../client/lib/vat/readings';
import { back, createTimer, finish, skip, start } from '../../../client/lib/vat/timer';
import { journalInputSchema } from '../../../shared/schemas/journal';
import { journalDto } from './fixtures';

const MIN = 60_000;
const T0 = Date.parse('2026-03-14T09:00:00Z');
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;

describe('the journal document the vat writes back', () => {
  it('is the DTO without its DTO-only fields, and passes the shared schema', () => {
    const doc = documentFromDto(journalDto());
    expect(doc).not.toHaveProperty('id');
    expect(doc).not.toHaveProperty('derived');
    expect(doc).not.toHaveProperty('readings');
    expect(doc.ingredients[0]).not.toHaveProperty('si');
    expect(doc.styleSlug).toBe('cheddar');
    expect(checkDocument(doc)).toBeNull();
    // Nothing is lost on the way through the schema (no defaults fill in what we dropped).
    expect(journalInputSchema.parse(doc)).toEqual(doc);
  });

  it('records start times with the offset, minutes and the last temperature of a step', () => {
    const dto = journalDto();
    let timer = start(createTimer(3), T0);
    timer = finish(timer, T0 + 31.5 * MIN);
    timer = start(timer, T0 + 32 * MIN);
    const readings = [
      {
        id: 'a',
        takenAt: new Date(T0 + 10 * MIN).toISOString(),
        tempC: 30.2,
        ph: null,
        stepIndex: 0,
        note: '',
      },
      {
        id: 'b',
        takenAt: new Date(T0 + 30 * MIN).toISOString(),
        tempC: 31.1,
        ph: 6.6,
        stepIndex: 0,
        note: '',
      },
      {
        id: 'c',
        takenAt: new Date(T0 + 33 * MIN).toISOString(),
        tempC: 31.4,
        ph: null,
        stepIndex: 1,
        note: '',
      },
    ];
    const doc = applyStepTimer(documentFromDto(dto), timer, readings, T0 + 40 * MIN);
    expect(Date.parse(doc.steps[0].startedAt!)).toBe(T0);
    expect(doc.steps[0].startedAt).toMatch(/[+-]\d{2}:\d{2}$/);
    expect(doc.steps[0].actualMinutes).toBe(31.5);
    expect(doc.steps[0].actualTempC).toBe(31.1);
    // The running step has its start, but no minutes or temperature until it ends.
    expect(Date.parse(doc.steps[1].startedAt!)).toBe(T0 + 32 * MIN);
    expect(doc.steps[1].actualMinutes).toBeNull();
    expect(doc.steps[1].actualTempC).toBeNull();
    expect(doc.steps[2]).toEqual(dto.steps[2]);
    expect(checkDocument(doc)).toBeNull();
    expect(lastTempOfStep(readings, 2)).toBeNull();

    // Back to the first step after a mistaken Finish: its minutes are open again.
    const reopened = applyStepTimer(doc, back(skip(timer, T0 + 41 * MIN)), readings, T0 + 42 * MIN);
    expect(reopened.steps[1].actualMinutes).toBeNull();
  });

  it('saves the green weight and moves the wheel on, never back', () => {
    const doc = documentFromDto(journalDto());
    const pressing = advanceWheel(doc, 'pressing');
    expect(pressing.wheelStatus).toBe('pressing');
    const drying = applyGreenWeight(pressing, 1.92);
    expect(drying).toMatchObject({ greenWeightKg: 1.92, wheelStatus: 'drying' });
    expect(advanceWheel(drying, 'pressing').wheelStatus).toBe('drying');
    expect(checkDocument(drying)).toBeNull();
    expect(checkDocument({ ...drying, greenWeightKg: -1 })).toMatch(/greenWeightKg/);
  });
});

describe('readings made at the vat', () => {
  it('get a client-made UUID, with or without crypto.randomUUID', () => {
    expect(newReadingId()).toMatch(UUID);
    const noRandomUuid = { getRandomValues: crypto.getRandomValues.bind(crypto) } as Crypto;
    const ids = new Set(Array.from({ length: 50 }, () => newReadingId(noRandomUuid)));
    expect(ids.size).toBe(50);
    for (const id of ids) expect(id).toMatch(UUID);
  });

  it('write local time with its offset', () => {
    expect(isoWithOffset(T0, 60)).toBe('2026-03-14T10:00:00.000+01:00');
    expect(isoWithOffset(T0, -300)).toBe('2026-03-14T04:00:00.000-05:00');
    expect(isoWithOffset(T0, 330)).toBe('2026-03-14T14:30:00.000+05:30');
    expect(isoWithOffset(T0, -210)).toBe('2026-03-14T05:30:00.000-03:30');
    expect(Date.parse(isoWithOffset(T0))).toBe(T0);
  });

  it('are checked with the shared schema', () => {
    const ok = makeReading({ tempC: 32, ph: 6.5, stepIndex: 1 }, T0);
    expect(ok.ok).toBe(true);
    const none = makeReading({ tempC: null, ph: null, stepIndex: 1 }, T0);
    expect(none).toMatchObject({ ok: false, field: 'tempC' });
    const badPh = makeReading({ tempC: null, ph: 12, stepIndex: 1 }, T0);
    expect(badPh).toMatchObject({ ok: false, field: 'ph' });
  });

  it('are listed once each, oldest first, queued ones marked', () => {
    const a = {
      id: 'a',
      takenAt: '2026-03-14T09:05:00Z',
      tempC: 31,
      ph: null,
      stepIndex: 0,
      note: '',
    };
    const b = { ...a, id: 'b', takenAt: '2026-03-14T09:01:00Z' };
    const c = { ...a, id: 'c', takenAt: '2026-03-14T09:10:00Z' };
    const list = mergeReadings([a], [a, b, c], new Set(['a', 'c']));
    expect(list.map((r) => [r.id, r.pending])).toEqual([
      ['b', false],
      ['a', false],
      ['c', true],
    ]);
  });
});

describe('the press schedule', () => {
  it('gives each stage its pressure on the curd for the mould', () => {
    const dto = journalDto();
    const rows = pressRows(dto.pressStages, dto.mould);
    // 50 lb on an 8-inch round mould is about 1.0 psi (6.9 kPa): TRADE.md, by the formula.
    expect(rows[1].psi).toBeCloseTo(0.995, 3);
    expect(rows[1].kPa).toBeCloseTo(6.86, 2);
    expect(rows.map((r) => r.stage)).toEqual([1, 2]);
  });

  it('leaves the pressure out when the mould size is unknown', () => {
    const mould = { shape: 'rectangular' as const, diameterMm: null, lengthMm: 200, widthMm: null };
    expect(faceOfMould(mould)).toBeNull();
    expect(pressRows([{ loadN: 100, minutes: 10 }], mould)[0]).toMatchObject({
      kPa: null,
      psi: null,
    });
    expect(faceOfMould({ ...mould, widthMm: 100 })).toEqual({
      shape: 'rectangular',
      lengthMm: 200,
      widthMm: 100,
    });
  });
});

describe('drying days', () => {
  const start = Date.parse('2026-03-14T20:00:00Z');
  it('lays out a day per drying day from the end of pressing, with today marked', () => {
    const plan = dryingPlan(start, 3, ['2026-03-14'], Date.parse('2026-03-15T09:00:00Z'), 'UTC');
    expect(plan.days.map((d) => [d.day, d.date, d.turned, d.isToday, d.isPast])).toEqual([
      [1, '2026-03-14', true, false, true],
      [2, '2026-03-15', false, true, false],
      [3, '2026-03-16', false, false, false],
    ]);
    expect(plan.turnDue).toBe(true);
    expect(plan.rindDate).toBe('2026-03-17');
    expect(plan.over).toBe(false);
    const after = dryingPlan(start, 3, [], Date.parse('2026-03-17T09:00:00Z'), 'UTC');
    expect(after).toMatchObject({ over: true, today: null, turnDue: false });
  });

  it('counts days where the maker is', () => {
    // 20:00 UTC on the 14th is already the 15th in Auckland.
    const plan = dryingPlan(start, 1, [], start, 'Pacific/Auckland');
    expect(plan.days[0].date).toBe('2026-03-15');
  });

  it('ticks and unticks a day', () => {
    expect(toggleTurned(['2026-03-15'], '2026-03-14')).toEqual(['2026-03-14', '2026-03-15']);
    expect(toggleTurned(['2026-03-14', '2026-03-15'], '2026-03-14')).toEqual(['2026-03-15']);
  });
});

describe('vat time formats', () => {
  it('shows clocks and targets', () => {
    expect(formatClock(0)).toBe('0:00');
    expect(formatClock(65_000)).toBe('1:05');
    expect(formatClock(-65_000)).toBe('1:05');
    expect(formatClock(3_725_000)).toBe('1:02:05');
    expect(formatMinutes(45)).toBe('45 min');
    expect(formatMinutes(90)).toBe('1 h 30 min');
    expect(formatMinutes(720)).toBe('12 h');
    expect(formatMinutes(4320)).toBe('3 days');
  });
});

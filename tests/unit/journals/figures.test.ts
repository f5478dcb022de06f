import { describe, expect, it } from 'vitest';
import {
  journalDerivedFigures,
  journalMetrics,
  mouldFace,
  type JournalFiguresInput,
} from '../../../shared/trade/journal-figures';
import { toKilograms, toLitres, toMillimetres, toNewtons } from '../../../shared/trade/units';

const base = (over: Partial<JournalFiguresInput> = {}): JournalFiguresInput => ({
  makeDate: '2026-01-10',
  milk: {
    volumeL: toLitres(4, 'gal'),
    species: 'cow',
    heatTreatment: 'pasteurised',
    fatPercent: null,
    proteinPercent: null,
  },
  mould: { shape: 'round', diameterMm: toMillimetres(8, 'in'), lengthMm: null, widthMm: null },
  ingredients: [],
  steps: [],
  pressStages: [],
  greenWeightKg: null,
  weighIns: [],
  readings: [],
  aging: { targetDays: null },
  ...over,
});

describe('journal metrics (composed from shared/trade)', () => {
  it('is all null for a bare journal', () => {
    expect(Object.values(journalMetrics(base())).every((v) => v === null)).toBe(true);
  });

  it('50 lb on an 8-inch round mould is about 6.9 kPa (common practice, no published source)', () => {
    const m = journalMetrics(base({ pressStages: [{ loadN: toNewtons(50, 'lbf'), minutes: 60 }] }));
    expect(m.pressMaxKpa).toBeCloseTo(6.86, 2);
    expect(
      mouldFace({ shape: 'rectangular', diameterMm: null, lengthMm: 200, widthMm: null }),
    ).toBeNull();
  });

  it('4 lb of cheese from 4 US gallons is about 11.6 % yield (common practice, no published source)', () => {
    const m = journalMetrics(base({ greenWeightKg: toKilograms(4, 'lb') }));
    expect(m.yieldPercent).toBeCloseTo(11.63, 2);
    // a green weight alone is no moisture loss yet
    expect(m.moistureLossPercent).toBeNull();
  });

  it('takes the first weigh-in as green when no green weight is given (definition)', () => {
    const m = journalMetrics(
      base({
        weighIns: [
          { date: '2026-02-01', massKg: 1.8 },
          { date: '2026-01-12', massKg: 2 },
        ],
      }),
    );
    expect(m.moistureLossPercent).toBeCloseTo(10, 9);
    expect(m.yieldPercent).toBeCloseTo((1.8 / (toLitres(4, 'gal') * 1.03)) * 100, 9);
  });

  it('rates only what can be rated: salt g/L by mass, colouring mL/L from volumes and drops', () => {
    const milkL = toLitres(4, 'gal');
    const weighed = journalMetrics(
      base({
        ingredients: [
          { kind: 'salt', amount: 20, unit: 'g', mlPerDrop: null },
          { kind: 'salt', amount: 10, unit: 'g', mlPerDrop: null },
          { kind: 'colouring', amount: 10, unit: 'drop', mlPerDrop: 0.05 },
          { kind: 'colouring', amount: 1, unit: 'mL', mlPerDrop: null },
          { kind: 'culture', amount: 0.25, unit: 'tsp', mlPerDrop: null },
        ],
      }),
    );
    expect(weighed.saltGPerL).toBeCloseTo(30 / milkL, 9);
    expect(weighed.colourMlPerL).toBeCloseTo(1.5 / milkL, 9);
    expect(weighed.cultureGPerL).toBeNull();
    const spooned = journalMetrics(
      base({
        ingredients: [
          { kind: 'salt', amount: 20, unit: 'g', mlPerDrop: null },
          { kind: 'salt', amount: 1, unit: 'tbsp', mlPerDrop: null },
        ],
      }),
    );
    expect(spooned.saltGPerL).toBeNull();
  });

  it('coagulation at its actual (else target) temperature; cook at the hottest cooking step', () => {
    const m = journalMetrics(
      base({
        steps: [
          { kind: 'coagulation', targetTempC: 32, actualTempC: null },
          { kind: 'cooking', targetTempC: 37, actualTempC: 37.5 },
          { kind: 'cooking', targetTempC: 39, actualTempC: null },
        ],
      }),
    );
    expect(m.coagulationTempC).toBe(32);
    expect(m.cookTempC).toBe(39);
  });

  it('cook ramp from the readings of the cooking step when they are tagged (common practice limit)', () => {
    const at = (min: number) => new Date(Date.UTC(2026, 0, 10, 10, min));
    const m = journalMetrics(
      base({
        steps: [
          { kind: 'warming', targetTempC: 31, actualTempC: null },
          { kind: 'cooking', targetTempC: 38, actualTempC: null },
        ],
        readings: [
          // a fast warm-up, not part of the cook
          { takenAt: at(0), tempC: 10, stepIndex: 0 },
          { takenAt: at(5), tempC: 31, stepIndex: 0 },
          { takenAt: at(30), tempC: 31, stepIndex: 1 },
          { takenAt: at(35), tempC: 32, stepIndex: 1 },
          { takenAt: at(40), tempC: 34, stepIndex: 1 },
        ],
      }),
    );
    expect(m.cookRampCPer5Min).toBeCloseTo(2, 9);
  });
});

describe('derived figures for the journal page', () => {
  it('predicts with Van Slyke only with fat and protein, stating the moisture (Van Slyke and Price 1949)', () => {
    const none = journalDerivedFigures(base(), '2026-02-01T12:00:00Z');
    expect(none.yield.predictedKgPer100Kg).toBeNull();
    const known = journalDerivedFigures(
      base({ milk: { ...base().milk, fatPercent: 3.6, proteinPercent: 2.5 / 0.78 } }),
      '2026-02-01T12:00:00Z',
    );
    // F 3.6, C 2.5, W 0.37 gives 9.945 (TRADE.md, computed from the formula)
    expect(known.yield.predictedKgPer100Kg).toBeCloseTo(9.945, 3);
    expect(known.yield.basis).toMatch(/37 % moisture/);
  });

  it('ages in calendar days, with the ready date and days left', () => {
    const d = journalDerivedFigures(base({ aging: { targetDays: 60 } }), '2026-02-01T23:00:00Z');
    expect(d.aging).toEqual({
      ageDays: 22,
      targetDays: 60,
      daysLeft: 38,
      readyDate: '2026-03-11',
      cut: false,
      openedOn: null,
      ageAtOpeningDays: null,
      rawMilkMinimumOn: null,
      readyBeforeRawMilkMinimum: false,
    });
  });

  it('stops the age of an opened or finished wheel at the day it was opened (common practice)', () => {
    // A camembert opened at 47 days and still shown months later.
    const opened = base({
      aging: { targetDays: 42, openedOn: '2026-02-26', wheelStatus: 'opened' },
    });
    const d = journalDerivedFigures(opened, '2026-04-25');
    expect(d.aging).toMatchObject({ cut: true, openedOn: '2026-02-26', ageAtOpeningDays: 47 });
    const finished = base({
      aging: { targetDays: 42, openedOn: '2026-02-26', wheelStatus: 'finished' },
    });
    expect(journalDerivedFigures(finished, '2026-09-01').aging.ageAtOpeningDays).toBe(47);
    const unknown = base({ aging: { targetDays: 42, openedOn: null, wheelStatus: 'opened' } });
    expect(journalDerivedFigures(unknown, '2026-04-25').aging).toMatchObject({
      cut: true,
      ageAtOpeningDays: null,
    });
    const aging = base({ aging: { targetDays: 42, openedOn: '2026-02-26', wheelStatus: 'aging' } });
    expect(journalDerivedFigures(aging, '2026-04-25').aging).toMatchObject({
      cut: false,
      openedOn: null,
    });
  });

  it('marks a raw-milk ready date before the 60-day mark (21 CFR 133.113)', () => {
    const raw = base({
      makeDate: '2026-12-02',
      milk: { ...base().milk, heatTreatment: 'raw' },
      aging: { targetDays: 45 },
    });
    const d = journalDerivedFigures(raw, '2026-12-10');
    expect(d.aging).toMatchObject({
      readyDate: '2027-01-16',
      rawMilkMinimumOn: '2027-01-31',
      readyBeforeRawMilkMinimum: true,
    });
  });

  it('cautions on unpasteurised milk, flagged before 60 days (21 CFR 133.113)', () => {
    const raw = base({ milk: { ...base().milk, heatTreatment: 'thermised' } });
    expect(journalDerivedFigures(raw, '2026-02-01').rawMilkCaution?.flagged).toBe(true);
    const old = journalDerivedFigures(raw, '2026-06-01').rawMilkCaution;
    expect(old?.flagged).toBe(false);
    expect(old?.text).toMatch(/unpasteurised/);
    expect(journalDerivedFigures(base(), '2026-02-01').rawMilkCaution).toBeNull();
  });
});

import { describe, expect, it } from 'vitest';
import type { CompareResultDto } from '../../../shared/types/compare';
import {
  countOf,
  filterWords,
  readingOf,
  signed,
  stepFor,
  type ReadingFilters,
} from '../../../client/components/compare/compareReading';
import {
  formatSideValue,
  parameterScale,
  scaleFor,
} from '../../../client/components/compare/compareUnits';

const NO_FILTERS: ReadingFilters = {
  styleNames: [],
  species: [],
  heat: [],
  rind: [],
  agingMin: null,
  agingMax: null,
  maker: '',
};

function numeric(patch: Partial<CompareResultDto> = {}): CompareResultDto {
  return {
    x: 'saltPerLitre',
    y: 'overall',
    per: 'tasting',
    kind: 'numeric',
    n: 23,
    meaningful: true,
    caution: null,
    points: [1.8, 2.4, 3.6].map((x, i) => ({
      x,
      y: 6,
      journalId: i + 1,
      title: `J${i}`,
      maker: 'ann',
      tastingId: i + 1,
    })),
    fit: {
      slope: 0.4,
      intercept: 5,
      r: 0.31,
      rSquared: 0.0961,
      slopeStandardError: 0.25,
      slopeInterval95: [-0.1, 0.9],
    },
    groups: [],
    ...patch,
  };
}

describe('Compare units', () => {
  it('converts temperatures with the offset and their slopes without it', () => {
    const f = parameterScale('cookTemp', 'us');
    expect(f.convert(38)).toBeCloseTo(100.4, 6);
    expect(f.factor).toBe(1.8);
    expect(parameterScale('cookRamp', 'us').convert(1)).toBeCloseTo(1.8, 6);
    expect(parameterScale('cookTemp', 'metric').convert(38)).toBe(38);
  });

  it('reads salt in oz per gallon and pressure in psi for US readers', () => {
    // 1 g/L = 3.785411784 g per gallon = 0.13353 oz per gallon (NIST SP 811 factors).
    expect(scaleFor('plain', 'g/L', 'us').factor).toBeCloseTo(0.133526, 5);
    expect(parameterScale('pressMaxKpa', 'us').convert(6.894757293168)).toBeCloseTo(1, 9);
  });

  it('formats side-by-side values by kind and unit', () => {
    expect(formatSideValue({ kind: 'temperature', unit: '°C' }, 32, 'us')).toBe('89.6 °F');
    expect(formatSideValue({ kind: 'plain', unit: 'g/L' }, 2.5, 'metric')).toBe('2.5 g per L');
    expect(formatSideValue({ kind: 'plain', unit: 'days' }, 1, 'metric')).toBe('1 day');
    expect(formatSideValue({ kind: 'date', unit: null }, '2026-03-14', 'metric')).toBe(
      '14 Mar 2026',
    );
    expect(formatSideValue({ kind: 'plain', unit: '%' }, null, 'metric')).toBe('–');
  });
});

describe('Compare reading', () => {
  it('says the slope per gram with its interval, and that an interval across zero shows no direction', () => {
    const r = readingOf(
      numeric(),
      { ...NO_FILTERS, styleNames: ['Cheddar'] },
      'metric',
      'Salt per litre of milk',
    );
    expect(r.text[0]).toBe(
      'Across 23 tastings of Cheddar, each extra gram of salt per litre of milk went with +0.4 points of overall liking (95 % interval \u22120.1 to +0.9).',
    );
    expect(r.text[1]).toMatch(/do not show a clear direction/);
    expect(r.text[2]).toMatch(/^r = 0\.31: a moderate relation; .* about 10 % of the spread/);
  });

  it('converts the slope to the reader’s units: per ounce per gallon', () => {
    const r = readingOf(
      numeric({ points: numeric().points.map((p) => ({ ...p, x: p.x * 10 })) }),
      NO_FILTERS,
      'us',
      'Salt per gallon of milk',
    );
    // Salt from 18 to 36 g/L is 2.4 to 4.8 oz/gal: a step of 1 oz/gal = 7.49 g/L, × 0.4.
    expect(r.text[0]).toContain('each extra ounce of salt per gallon of milk went with +3 points');
  });

  it('reads per °F for a cooking temperature', () => {
    const dto = numeric({
      x: 'cookTemp',
      points: [36, 38, 40].map((x, i) => ({ ...numeric().points[i], x })),
      fit: { ...numeric().fit!, slope: 0.36, slopeInterval95: [0.18, 0.54] },
    });
    const r = readingOf(dto, NO_FILTERS, 'us', 'Cooking temperature');
    expect(r.text[0]).toContain('each 1 °F higher cooking temperature went with +0.2 points');
    expect(r.text[1]).toMatch(/^The whole interval is above zero/);
  });

  it('shows no line when the server says the fit is not meaningful', () => {
    const r = readingOf(
      numeric({ n: 1, meaningful: false, fit: null }),
      NO_FILTERS,
      'metric',
      'Salt',
    );
    expect(r).toEqual({ text: ['Across 1 tasting.'], notMeaningful: true });
  });

  it('names the filters and gets plurals right', () => {
    expect(countOf(1, 'journal')).toBe('1 batch');
    expect(countOf(4, 'journal')).toBe('4 batches');
    expect(
      filterWords({
        ...NO_FILTERS,
        styleNames: ['Cheddar', 'Gouda'],
        species: ['cow'],
        heat: ['raw'],
        rind: ['waxed'],
        agingMin: 60,
        agingMax: 180,
        maker: 'ann',
      }),
    ).toBe(
      " of Cheddar or Gouda from raw cow's milk, waxed, with an aging target of 60 to 180 days, made by @ann",
    );
  });

  it('picks a round step near the spread, at most a degree for temperatures', () => {
    expect(stepFor(1.8, 'plain')).toBe(1);
    expect(stepFor(0.1, 'plain')).toBeCloseTo(0.1, 12);
    expect(stepFor(335, 'plain')).toBe(100);
    expect(stepFor(12, 'temperature')).toBe(1);
    expect(signed(-0.123)).toBe('\u22120.12');
    expect(signed(0)).toBe('0');
  });
});

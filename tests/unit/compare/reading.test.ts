import { describe, expect, it } from 'vitest';
import type { CompareResultDto } from '../../../shared/types/compare';
import {
  countOf,
  filterWords,
  INTERVAL_MEANING,
  readingOf,
  signed,
  stepFor,
  strengthOf,
  type ReadingFilters,
} from '../../../client/components/compare/compareReading';
import { CORRELATION_SIZE } from '../../../shared/constants/compare';
import { correlationSize } from '../../../shared/trade/stats';
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
    per: 'journal',
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
      tastingId: null,
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
      'Across 23 batches of Cheddar (each the mean of its tastings), each extra gram of salt per litre of milk went with +0.4 points of overall liking (95 % interval \u22120.1 to +0.9).',
    );
    // The interval is explained in words once, right under it.
    expect(r.text[1]).toBe(INTERVAL_MEANING);
    expect(r.text[1]).toMatch(/holds the true slope 95 times in 100/);
    expect(r.text[2]).toMatch(/do not show a clear direction/);
    expect(r.text[3]).toMatch(
      /^r = 0\.31 over 23 batches: a medium correlation by Cohen's rule of thumb \(0\.1 small, 0\.3 medium, 0\.5 large; Cohen 1988\)\. r runs from \u22121 to \+1/,
    );
    expect(r.text[3]).toMatch(/about 10 % of the spread in overall liking/);
    // Always, with n: a relation across members' batches is not a cause.
    expect(r.caveat).toMatch(
      /^A relation across these 23 batches from members' journals is not a cause: the milk, the culture, the cave and the tasters/,
    );
    // One style chosen: no styles caution; one point per batch: no pseudo-replication caution.
    expect(r.notes).toEqual([]);
  });

  it('never calls r = 0.57 strong; says a large r over few batches can come by chance when the interval crosses zero', () => {
    const dto = numeric({
      n: 7,
      fit: { ...numeric().fit!, r: 0.57, rSquared: 0.3249, slopeInterval95: [-0.022, 1.7] },
    });
    const r = readingOf(dto, { ...NO_FILTERS, styleNames: ['Feta'] }, 'metric', 'Salt');
    const line = r.text.find((t) => t.startsWith('r = '))!;
    expect(line).toMatch(/^r = 0\.57 over 7 batches: a large correlation by Cohen/);
    expect(line).not.toMatch(/strong/);
    expect(line).toMatch(/With only 7 batches, even an r this size can come about by chance/);
    expect(r.caveat).toMatch(/these 7 batches .* not a cause/);
    // A whole interval above zero needs no such remark, but keeps "not a cause".
    const sure = readingOf(
      numeric({ fit: { ...numeric().fit!, r: 0.57, slopeInterval95: [0.1, 0.9] } }),
      NO_FILTERS,
      'metric',
      'Salt',
    ).text.find((t) => t.startsWith('r = '))!;
    expect(sure).not.toMatch(/by chance/);
  });

  it("names a correlation's size by Cohen's convention (Cohen 1988, Statistical Power Analysis for the Behavioral Sciences, 2nd ed., §3.2)", () => {
    // Cohen's conventional values for r: 0.10 small, 0.30 medium, 0.50 large.
    expect(CORRELATION_SIZE).toMatchObject({ small: 0.1, medium: 0.3, large: 0.5 });
    expect(CORRELATION_SIZE.source).toMatch(/^Cohen, J\. \(1988\)/);
    expect(correlationSize(0.05)).toBe('below small');
    expect(correlationSize(0.1)).toBe('small');
    expect(correlationSize(-0.29)).toBe('small');
    expect(correlationSize(0.3)).toBe('medium');
    expect(correlationSize(0.57)).toBe('large');
    expect(correlationSize(-0.9)).toBe('large');
    expect(() => correlationSize(Number.NaN)).toThrow(RangeError);
    expect(strengthOf(-0.57)).toBe('a large');
    expect(strengthOf(0.04)).toBe('a below-small');
  });

  it('per tasting: names the batches the tastings come from and warns of pseudo-replication', () => {
    // 6 tastings of 3 wheels, two each.
    const points = [1.8, 1.8, 2.4, 2.4, 3.6, 3.6].map((x, i) => ({
      x,
      y: 6,
      journalId: Math.floor(i / 2) + 1,
      title: `J${i}`,
      maker: 'ann',
      tastingId: i + 1,
    }));
    const r = readingOf(
      numeric({ per: 'tasting', n: 6, points }),
      { ...NO_FILTERS, styleNames: ['Cheddar'] },
      'metric',
      'Salt per litre of milk',
    );
    expect(r.text[0]).toMatch(/^Across 6 tastings of 3 batches of Cheddar, each extra gram/);
    expect(r.caveat).toMatch(/^A relation across these 6 tastings /);
    expect(r.notes.map((n) => n.key)).toEqual(['per-tasting']);
    const note = r.notes[0];
    expect(note.text).toMatch(/^These 6 tastings come from only 3 batches\. /);
    expect(note.text).toMatch(/not independent/);
    expect(note.text).toMatch(/95 % interval too narrow/);
    expect(note.text).toMatch(/pseudo-replication/);
    expect(note.text).toMatch(/Choose “One batch”/);
    // An interval above zero per tasting is not read as a clear direction.
    const above = readingOf(
      numeric({
        per: 'tasting',
        n: 6,
        points,
        fit: { ...numeric().fit!, slopeInterval95: [0.1, 0.7] },
      }),
      { ...NO_FILTERS, styleNames: ['Cheddar'] },
      'metric',
      'Salt per litre of milk',
    );
    expect(above.text[2]).toMatch(/^The whole interval is above zero, but .* too narrow/);
  });

  it('with no style or several, says styles differ for a parameter that varies by style', () => {
    const none = readingOf(numeric(), NO_FILTERS, 'metric', 'Salt per litre of milk');
    expect(none.notes.map((n) => n.key)).toEqual(['styles']);
    expect(none.notes[0].text).toMatch(
      /^Salt per litre of milk differs a lot from one style to another: a feta .* camembert .*every style mixed together.*Pick one style/,
    );
    const two = readingOf(
      numeric(),
      { ...NO_FILTERS, styleNames: ['Feta', 'Camembert'] },
      'metric',
      'Salt per litre of milk',
    );
    expect(two.notes[0].text).toMatch(/With Feta and Camembert mixed together/);
    // Calcium chloride follows the milk rather than the style: no caution.
    expect(
      readingOf(numeric({ x: 'calciumChloridePerLitre' }), NO_FILTERS, 'metric', 'CaCl').notes,
    ).toEqual([]);
  });

  it('adds the raw-milk caution for heat treatment, and for a raw or thermised filter', () => {
    const heat: CompareResultDto = {
      ...numeric(),
      x: 'heatTreatment',
      kind: 'categorical',
      points: [],
      fit: null,
      n: 7,
      groups: [
        {
          group: 'raw',
          label: 'Raw (unpasteurised)',
          n: 2,
          mean: 7.4,
          median: 7.4,
          q1: 7.2,
          q3: 7.6,
          min: 7,
          max: 7.8,
        },
        {
          group: 'pasteurised',
          label: 'Pasteurised',
          n: 5,
          mean: 6.2,
          median: 6,
          q1: 5.5,
          q3: 6.8,
          min: 5,
          max: 7.5,
        },
      ],
    };
    const r = readingOf(heat, NO_FILTERS, 'metric', 'Heat treatment');
    expect(r.text[0]).toMatch(
      /the highest average overall liking was for raw \(unpasteurised\) \(7\.4 over 2 batches\)/,
    );
    expect(r.notes.map((n) => n.key)).toEqual(['raw-milk']);
    const raw = r.notes[0];
    expect(raw.text).toMatch(/Listeria, E\. coli O157:H7, Salmonella, Campylobacter and Brucella/);
    expect(raw.text).toMatch(/say nothing about whether a cheese is safe/);
    expect(raw.text).toMatch(/local food codes/);
    const filtered = readingOf(
      numeric(),
      { ...NO_FILTERS, styleNames: ['Feta'], heat: ['thermised'] },
      'metric',
      'Salt',
    );
    expect(filtered.notes.map((n) => n.key)).toEqual(['raw-milk']);
    expect(
      readingOf(
        numeric(),
        { ...NO_FILTERS, styleNames: ['Feta'], heat: ['pasteurised'] },
        'metric',
        'Salt',
      ).notes,
    ).toEqual([]);
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
    expect(r.text[2]).toMatch(/^The whole interval is above zero/);
  });

  it('shows no line when the server says the fit is not meaningful', () => {
    const r = readingOf(
      numeric({ n: 1, meaningful: false, fit: null }),
      NO_FILTERS,
      'metric',
      'Salt',
    );
    expect(r.text).toEqual(['Across 1 batch (each the mean of its tastings).']);
    expect(r.notMeaningful).toBe(true);
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

import { describe, expect, it } from 'vitest';
import { STYLES } from '../../shared/constants/styles';
import { DEFECTS, FLAVOUR_DESCRIPTORS, typicalTraitsOf } from '../../shared/constants/tasting';

// The scorecard's word lists: the terms of Drake et al. 2001 and of the ADSA scorecard / USDA
// grades for Cheddar (TRADE.md, Scoring); the meanings and the style exceptions are ours
// ([memory]; common practice, no published source).
describe('scorecard terms', () => {
  it('gives every descriptor and defect a short plain meaning', () => {
    for (const term of [...FLAVOUR_DESCRIPTORS, ...DEFECTS]) {
      expect(term.hint.length, term.key).toBeGreaterThan(10);
      expect(term.hint.length, term.key).toBeLessThan(120);
    }
  });

  it('names only styles that exist when a trait is a style’s own', () => {
    const slugs = new Set(STYLES.map((s) => s.slug));
    for (const d of DEFECTS) for (const slug of d.typicalIn) expect(slugs, slug).toContain(slug);
  });

  it('does not call a crumbly style crumbly as a defect, nor a soft one pasty; cheddar keeps the full list', () => {
    expect(typicalTraitsOf('caerphilly').has('crumbly')).toBe(true);
    expect(typicalTraitsOf('feta').has('crumbly')).toBe(true);
    expect(typicalTraitsOf('camembert').has('pasty')).toBe(true);
    expect(typicalTraitsOf('stilton-type').has('open')).toBe(true);
    expect(typicalTraitsOf('cheddar').size).toBe(0);
    expect(typicalTraitsOf(undefined).size).toBe(0);
  });
});

import { describe, expect, it } from 'vitest';
import { agingRangeProblem } from '../../client/composables/journalDisplay';

describe('the aging range filters (Discover and Compare)', () => {
  it('warns when "to" comes before "from", since no batch can match', () => {
    expect(agingRangeProblem(240, 60)).toBe(
      '60 days is before 240: no batch can match. Swap them or clear one.',
    );
  });

  it('says nothing for an open, equal or ordered range', () => {
    expect(agingRangeProblem(null, 60)).toBeUndefined();
    expect(agingRangeProblem(60, null)).toBeUndefined();
    expect(agingRangeProblem(undefined, undefined)).toBeUndefined();
    expect(agingRangeProblem(90, 90)).toBeUndefined();
    expect(agingRangeProblem(0, 365)).toBeUndefined();
  });
});

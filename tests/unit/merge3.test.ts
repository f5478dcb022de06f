import { describe, expect, it } from 'vitest';
import { describePath, merge3, resolveConflicts } from '../../client/lib/merge3';

// common practice, no published source: a three-way merge as version control tools do it.
const base = {
  title: 'Cheddar',
  notes: '',
  greenWeightKg: null as number | null,
  steps: [
    { key: 'a', kind: 'cooking', startedAt: null as string | null, note: '' },
    { key: 'b', kind: 'pressing', startedAt: null as string | null, note: '' },
  ],
  weighIns: [{ date: '2026-03-01', massKg: 2 }],
};
const copy = () => JSON.parse(JSON.stringify(base)) as typeof base;

describe('merge3', () => {
  it('takes each side where only it changed, down to one field of one step', () => {
    const mine = copy();
    mine.steps[0].startedAt = '2026-03-14T09:00:00+01:00';
    mine.greenWeightKg = 2.1;
    const theirs = copy();
    theirs.steps[0].note = 'Stirred gently';
    theirs.notes = 'Good curd';
    const r = merge3(base, mine, theirs);
    expect(r.conflicts).toEqual([]);
    expect(r.merged.steps[0]).toMatchObject({
      startedAt: '2026-03-14T09:00:00+01:00',
      note: 'Stirred gently',
    });
    expect(r.merged).toMatchObject({ greenWeightKg: 2.1, notes: 'Good curd' });
    expect(r.theirChanges.sort()).toEqual(['notes', 'steps.0.note']);
  });

  it('reports a value changed differently on both sides and settles it either way', () => {
    const mine = { ...copy(), title: 'Mine' };
    const theirs = { ...copy(), title: 'Theirs', notes: 'kept' };
    const r = merge3(base, mine, theirs);
    expect(r.conflicts).toEqual([
      { path: 'title', base: 'Cheddar', mine: 'Mine', theirs: 'Theirs' },
    ]);
    expect(resolveConflicts(r, 'mine')).toMatchObject({ title: 'Mine', notes: 'kept' });
    expect(resolveConflicts(r, 'theirs')).toMatchObject({ title: 'Theirs', notes: 'kept' });
    expect(base.title).toBe('Cheddar');
  });

  it('keeps weigh-ins from both sides and ignores row keys', () => {
    const mine = copy();
    mine.weighIns.push({ date: '2026-03-08', massKg: 1.9 });
    mine.steps[1].key = 'z';
    const theirs = copy();
    theirs.weighIns.push({ date: '2026-03-07', massKg: 1.95 });
    const r = merge3(base, mine, theirs, { ignoreKeys: ['key'], unionLists: ['weighIns'] });
    expect(r.conflicts).toEqual([]);
    expect(r.merged.weighIns.map((w) => w.date)).toEqual([
      '2026-03-01',
      '2026-03-07',
      '2026-03-08',
    ]);
    expect(r.merged.steps[1].key).toBe('z');
  });

  it('is a conflict when the step lists differ in length on both sides', () => {
    const mine = copy();
    mine.steps[0].startedAt = 'x';
    const theirs = copy();
    theirs.steps.pop();
    const r = merge3(base, mine, theirs);
    expect(r.conflicts.map((c) => c.path)).toEqual(['steps']);
  });

  it('names paths as a maker reads them', () => {
    expect(describePath('steps.2.actualMinutes')).toBe('Step 3: actual minutes');
    expect(describePath('milk.volumeL')).toBe('Milk: volume');
    expect(describePath('title')).toBe('Title');
  });
});

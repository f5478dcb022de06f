import { describe, expect, it } from 'vitest';
import { numberInputText, readNumberInput } from '../../client/lib/number-input';

// What makers type into number fields. The decimal comma is the decimal sign of most of
// Europe and of ISO 80000-1:2022 §7.3.2 ("the decimal sign is either a comma or a point on
// the line"); anything else is refused with a reason rather than guessed.
describe('reading a number as typed', () => {
  it('takes a point or a comma for the decimals', () => {
    expect(readNumberInput('3.8')).toEqual({ kind: 'number', value: 3.8 });
    expect(readNumberInput(' 3,8 ')).toEqual({ kind: 'number', value: 3.8 });
    expect(readNumberInput('0,4')).toEqual({ kind: 'number', value: 0.4 });
    expect(readNumberInput(',5')).toEqual({ kind: 'number', value: 0.5 });
    expect(readNumberInput('-2')).toEqual({ kind: 'number', value: -2 });
    expect(readNumberInput('15')).toEqual({ kind: 'number', value: 15 });
  });

  it('says how it read a comma that could be a thousands separator', () => {
    expect(readNumberInput('1,450')).toEqual({
      kind: 'number',
      value: 1.45,
      note: 'Read as 1.45 (a decimal comma).',
    });
  });

  it('waits while a number is half typed, and knows an empty box', () => {
    expect(readNumberInput('3,')).toEqual({ kind: 'partial' });
    expect(readNumberInput('-')).toEqual({ kind: 'partial' });
    expect(readNumberInput('   ')).toEqual({ kind: 'empty' });
  });

  it('refuses, with a reason, what it would otherwise have to guess', () => {
    const reason = (text: string, opts = {}) => {
      const r = readNumberInput(text, opts);
      return r.kind === 'invalid' ? r.message : r.kind;
    };
    expect(reason('5 gal', { unit: 'L' })).toMatch(/number only: this field is in L/);
    expect(reason('88F')).toMatch(/without a unit/);
    expect(reason('1:20')).toMatch(/80 for 1 h 20 min/);
    expect(reason('1h 20')).toMatch(/80 for 1 h 20 min/);
    expect(reason('a pinch')).toMatch(/go in the notes/);
    expect(reason('1.250,5')).toMatch(/no thousands separator/);
    expect(reason('2.5', { whole: true })).toMatch(/Whole numbers only/);
  });

  it('writes a stored value back as text', () => {
    expect(numberInputText(2.5)).toBe('2.5');
    expect(numberInputText(null)).toBe('');
    expect(numberInputText(Number.NaN)).toBe('');
  });
});

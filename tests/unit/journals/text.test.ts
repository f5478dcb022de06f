import { describe, expect, it } from 'vitest';
import { csvField, toCsv } from '../../../server/lib/csv';
import { toBooleanQuery } from '../../../server/lib/fulltext';

describe('full-text query from free text', () => {
  it('keeps words only, each required and as a prefix', () => {
    expect(toBooleanQuery('Washed rind')).toBe('+washed* +rind*');
    expect(toBooleanQuery('+brine -natural "cloth')).toBe('+brine* +natural* +cloth*');
    expect(toBooleanQuery("x' OR 1=1; --")).toBeNull();
  });

  it('drops short words and InnoDB stopwords, which would match nothing when required', () => {
    expect(toBooleanQuery('the rind of a tomme')).toBe('+rind* +tomme*');
    expect(toBooleanQuery('on it')).toBeNull();
  });

  it('keeps letters beyond ASCII', () => {
    expect(toBooleanQuery('Fromage affiné')).toBe('+fromage* +affiné*');
  });
});

describe('CSV (RFC 4180)', () => {
  it('quotes fields with commas, quotes or line breaks and doubles quotes', () => {
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a, b')).toBe('"a, b"');
    expect(csvField('say "cheese"')).toBe('"say ""cheese"""');
    expect(csvField('one\ntwo')).toBe('"one\ntwo"');
    expect(csvField(null)).toBe('');
    expect(csvField(1.5)).toBe('1.5');
  });

  it('defuses text a spreadsheet would run as a formula (OWASP CSV injection)', () => {
    expect(csvField('=HYPERLINK("x")')).toBe('"\'=HYPERLINK(""x"")"');
    expect(csvField(-3)).toBe('-3');
  });

  it('ends every record with CRLF', () => {
    expect(toCsv(['a', 'b'], [[1, 'x']])).toBe('a,b\r\n1,x\r\n');
  });
});

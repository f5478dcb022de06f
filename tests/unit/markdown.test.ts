import { describe, expect, it } from 'vitest';
import { renderComment, renderNotes } from '../../server/lib/markdown';

// Hostile inputs after the OWASP Cross Site Scripting Prevention Cheat Sheet and the XSS Filter
// Evasion Cheat Sheet (OWASP Foundation, cheatsheetseries.owasp.org): script tags, event
// handlers, javascript: links, SVG and frames.
const HOSTILE = [
  '<script>alert(1)</script>',
  '<img src=x onerror=alert(1)>',
  '[click](javascript:alert(1))',
  '<svg onload=alert(1)>',
  '<iframe src="https://example.invalid"></iframe>',
  '<a href="javascript:alert(1)">x</a>',
];

/** Live markup that could run a script: a tag, a handler attribute inside a tag, a link. */
const unsafe = (html: string) =>
  /<(script|iframe|svg|object|embed)\b/i.test(html) ||
  /<[^>]+\son\w+\s*=/i.test(html) ||
  /<a\b[^>]*href="\s*javascript:/i.test(html);

describe('notes and comments rendered to safe HTML', () => {
  it('tells live markup from escaped text', () => {
    expect(unsafe('<img src="x" onerror="alert(1)">')).toBe(true);
    expect(unsafe('<p>&lt;img src=x onerror=alert(1)&gt;</p>')).toBe(false);
  });

  it('renders the Markdown makers write', () => {
    const html = renderNotes('Cooked to **38 °C**, then\n\n- milled\n- salted');
    expect(html).toContain('<strong>38 °C</strong>');
    expect(html).toContain('<li>milled</li>');
    expect(renderNotes('   ')).toBe('');
  });

  it('is as safe the second time a text is asked for (remembered) as the first', () => {
    for (const source of HOSTILE) {
      const first = renderNotes(source);
      const again = renderNotes(source);
      expect(again).toBe(first);
      for (const html of [first, again]) expect(unsafe(html), html).toBe(false);
      const comment = renderComment(source);
      expect(renderComment(source)).toBe(comment);
      expect(unsafe(comment) || /<img\b/i.test(comment), comment).toBe(false);
    }
  });

  it('keeps notes and comments apart: the same text may show an image in notes only', () => {
    const source = '![the wheel](https://example.invalid/w.webp) after 90 days';
    expect(renderNotes(source)).toContain('<img');
    expect(renderComment(source)).not.toContain('<img');
  });

  it('marks links as leaving the site', () => {
    expect(renderComment('see https://example.invalid/press')).toContain('rel="nofollow noopener"');
  });
});

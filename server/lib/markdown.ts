import createDOMPurify, { type WindowLike } from 'dompurify';
import { JSDOM } from 'jsdom';
import { LRUCache } from 'lru-cache';
import MarkdownIt from 'markdown-it';

// One markdown-it and one DOMPurify on one jsdom window for the life of the process: building
// a window is the slow part. Raw HTML in the source is escaped by markdown-it (html: false),
// and DOMPurify is the second fence for anything the renderer lets through.
const markdown = new MarkdownIt({ html: false, linkify: true, typographer: false });
const window = new JSDOM('').window;
const purify = createDOMPurify(window as unknown as WindowLike);

// Links members post lead off the site: no referrer credit for spam, no window.opener.
purify.addHook('afterSanitizeAttributes', (node) => {
  if (node.tagName === 'A' && node.hasAttribute('href')) {
    node.setAttribute('rel', 'nofollow noopener');
  }
});

/**
 * Remembers the HTML of recently rendered texts. Rendering is a pure function of the source
 * (the same Markdown always gives the same safe HTML), so a remembered answer is never stale,
 * on any app server; sanitising on jsdom costs milliseconds per journal, which every uncached
 * read of a journal page or a comment thread would otherwise pay again. Bounded by the
 * characters held (sources and results): about 8 MB of strings for each renderer at most.
 */
function remembered(render: (source: string) => string): (source: string) => string {
  const cache = new LRUCache<string, string>({
    maxSize: 4_000_000,
    sizeCalculation: (html, source) => html.length + source.length || 1,
  });
  return (source) => {
    const hit = cache.get(source);
    if (hit !== undefined) return hit;
    const html = render(source);
    // A text larger than the whole budget is rendered each time rather than held.
    if (html.length + source.length < 4_000_000) cache.set(source, html);
    return html;
  };
}

/** Renders a member's Markdown notes to HTML that is safe to insert into a page. */
export const renderNotes = remembered(function renderNotes(source: string): string {
  if (!source.trim()) return '';
  const html = markdown.render(source);
  return purify.sanitize(html, {
    USE_PROFILES: { html: true },
    FORBID_TAGS: ['style', 'form', 'input', 'button', 'textarea', 'select', 'iframe'],
    FORBID_ATTR: ['style'],
  });
});

// Comments and bios: the same fences, and no images at all (no tracking pixels, no hot-linked
// pictures in someone else's journal). markdown-it's image rule is off, so ![x](y) stays text.
const shortMarkdown = new MarkdownIt({ html: false, linkify: true, typographer: false }).disable(
  'image',
);

const COMMENT_TAGS = [
  'p',
  'br',
  'strong',
  'em',
  's',
  'a',
  'code',
  'pre',
  'blockquote',
  'ul',
  'ol',
  'li',
  'h1',
  'h2',
  'h3',
  'h4',
  'h5',
  'h6',
  'hr',
  'table',
  'thead',
  'tbody',
  'tr',
  'th',
  'td',
];

/** Renders a comment or a bio to safe HTML: links and basic formatting, never images. */
export const renderComment = remembered(function renderComment(source: string): string {
  if (!source.trim()) return '';
  return purify.sanitize(shortMarkdown.render(source), {
    // An allowlist: only what markdown-it writes for text, links, lists, quotes and code, so
    // no embedded media, forms or frames can appear, whatever the input.
    ALLOWED_TAGS: COMMENT_TAGS,
    ALLOWED_ATTR: ['href', 'title', 'rel', 'start'],
    FORBID_ATTR: ['style', 'src', 'srcset'],
  });
});

import createDOMPurify, { type WindowLike } from 'dompurify';
import { JSDOM } from 'jsdom';
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

/** Renders a member's Markdown notes to HTML that is safe to insert into a page. */
export function renderNotes(source: string): string {
  if (!source.trim()) return '';
  const html = markdown.render(source);
  return purify.sanitize(html, {
    USE_PROFILES: { html: true },
    FORBID_TAGS: ['style', 'form', 'input', 'button', 'textarea', 'select', 'iframe'],
    FORBID_ATTR: ['style'],
  });
}

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
export function renderComment(source: string): string {
  if (!source.trim()) return '';
  return purify.sanitize(shortMarkdown.render(source), {
    // An allowlist: only what markdown-it writes for text, links, lists, quotes and code, so
    // no embedded media, forms or frames can appear, whatever the input.
    ALLOWED_TAGS: COMMENT_TAGS,
    ALLOWED_ATTR: ['href', 'title', 'rel', 'start'],
    FORBID_ATTR: ['style', 'src', 'srcset'],
  });
}

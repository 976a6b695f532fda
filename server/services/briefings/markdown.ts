import { Marked } from 'marked';
import sanitizeHtml from 'sanitize-html';

// A private instance: settings here never leak into other users of `marked`.
const marked = new Marked({ gfm: true, breaks: false, async: false });

/** Tags a briefing narrative may use; everything else (script, style, iframe, img, forms) is dropped. */
const SAFE_TAGS = ['p', 'br', 'strong', 'em', 'del', 'code', 'pre', 'blockquote', 'ul', 'ol', 'li', 'h3', 'h4', 'h5', 'h6', 'a', 'hr', 'table', 'thead', 'tbody', 'tr', 'th', 'td'];

/** Tags dropped together with their text, on the page and in the PDF alike (see pdf/markdown-blocks.ts). */
export const NON_TEXT_TAGS = ['script', 'style', 'textarea', 'option', 'xmp', 'noscript', 'title'];

const SANITISE: sanitizeHtml.IOptions = {
  allowedTags: SAFE_TAGS,
  nonTextTags: NON_TEXT_TAGS,
  // Only links keep attributes (rel and target are set below); no style, no on* handlers.
  allowedAttributes: { a: ['href', 'title', 'rel', 'target'] },
  allowedSchemes: ['http', 'https', 'mailto'],
  allowedSchemesAppliedToAttributes: ['href'],
  allowProtocolRelative: false,
  disallowedTagsMode: 'discard',
  // Headings in a section body sit below the section heading.
  transformTags: {
    h1: 'h3',
    h2: 'h4',
    a: sanitizeHtml.simpleTransform('a', { rel: 'noopener noreferrer nofollow', target: '_blank' }),
  },
};

/** Markdown to HTML that is safe to insert into a page: scripts, handlers and javascript: links are removed. */
export function renderMarkdown(markdown: string): string {
  const html = marked.parse(markdown) as string;
  return sanitizeHtml(html, SANITISE);
}

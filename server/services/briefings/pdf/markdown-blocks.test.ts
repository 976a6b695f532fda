import { describe, expect, it } from 'vitest';
import { renderMarkdown } from '../markdown';
import { markdownBlocks } from './markdown-blocks';

/** What a reader sees of sanitised HTML: its text, entities decoded, blanks collapsed. */
const pageText = (html: string) => html.replace(/<[^>]+>/g, ' ')
  .replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&amp;/g, '&')
  .replace(/\s+/g, ' ').trim();
const pdfText = (markdown: string) => markdownBlocks(markdown).map((b) => (b.kind === 'list' ? b.items.join(' ') : b.text)).join(' ').replace(/\s+/g, ' ').trim();

// Payloads after the OWASP XSS Filter Evasion Cheat Sheet (script, event handlers, javascript: URLs,
// style and textarea content), inline and as blocks of their own.
const PAYLOADS = [
  'Note <script>alert(1)</script> end',
  'Note <SCRIPT SRC=//evil.example/xss.js></SCRIPT> end',
  'Note <ScRiPt>document.cookie</sCrIpT> end',
  'Note <IMG SRC="javascript:alert(\'XSS\');"> end',
  'Note <img src=x onerror=alert(2)> end',
  'Note <style>body { display: none }</style> end',
  'Note <a href="javascript:alert(3)">label</a> end',
  'Note <iframe src=javascript:alert(4)></iframe> end',
  'Note <textarea>stolen text</textarea> end',
  'Note <BODY ONLOAD=alert(5)> end',
  '<script>alert(6)</script>\n\nAfter the block',
  'Dust & soot: **more** melt in *July* <br> next line',
];

describe('the PDF narrative', () => {
  it.each(PAYLOADS)('holds the same text as the page for %j', (markdown) => {
    expect(pdfText(markdown)).toBe(pageText(renderMarkdown(markdown)));
  });

  it('keeps nothing the page removed: no script, style or textarea text', () => {
    const all = PAYLOADS.map(pdfText).join(' ');
    expect(all).not.toMatch(/alert\(|document\.cookie|display: none|stolen text/);
    expect(all).toContain('Note');
    expect(all).toContain('After the block');
  });
});

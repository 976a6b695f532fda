import { Lexer, type Token, type Tokens } from 'marked';
import { NON_TEXT_TAGS } from '../markdown';

/** A block of narrative as the PDF sets it: plain text only, no markup and no raw HTML. */
export type TextBlock =
  | { kind: 'heading'; text: string }
  | { kind: 'paragraph'; text: string }
  | { kind: 'list'; ordered: boolean; items: string[] }
  | { kind: 'code'; text: string };

/** The tag an inline HTML token opens or closes ("<script …>" → open script), if any. */
function tagOf(raw: string): { name: string; closing: boolean; selfClosing: boolean } | null {
  const match = /^<\s*(\/)?\s*([a-z][a-z0-9-]*)/i.exec(raw);
  return match ? { name: match[2].toLowerCase(), closing: Boolean(match[1]), selfClosing: /\/\s*>$/.test(raw) } : null;
}

/**
 * Inline tokens to plain text, as the page's sanitiser leaves them: raw HTML tags are dropped, and
 * so is the text inside script, style and the other tags it drops whole; links keep their address
 * in brackets.
 */
function plain(tokens: Token[] | undefined): string {
  if (!tokens) return '';
  let inside: string | null = null;
  return tokens.map((t) => {
    if (t.type === 'html') {
      const tag = tagOf(t.raw);
      if (tag && !tag.closing && !tag.selfClosing && !inside && NON_TEXT_TAGS.includes(tag.name)) inside = tag.name;
      else if (tag?.closing && tag.name === inside) inside = null;
      return '';
    }
    if (inside) return '';
    switch (t.type) {
      case 'link': {
        const label = plain((t as Tokens.Link).tokens);
        const href = (t as Tokens.Link).href;
        return /^(https?|mailto):/i.test(href) && href !== label ? `${label} (${href})` : label;
      }
      case 'codespan': return (t as Tokens.Codespan).text;
      case 'br': return '\n';
      case 'escape': return (t as Tokens.Escape).text;
      default: return 'tokens' in t && t.tokens ? plain(t.tokens) : 'text' in t ? String(t.text) : '';
    }
  }).join('');
}

/** Markdown narrative split into blocks the PDF can set as text (never interpreted as HTML). */
export function markdownBlocks(markdown: string): TextBlock[] {
  const blocks: TextBlock[] = [];
  for (const token of new Lexer({ gfm: true }).lex(markdown)) {
    switch (token.type) {
      case 'heading': blocks.push({ kind: 'heading', text: plain((token as Tokens.Heading).tokens) }); break;
      case 'paragraph': blocks.push({ kind: 'paragraph', text: plain((token as Tokens.Paragraph).tokens) }); break;
      case 'blockquote': blocks.push({ kind: 'paragraph', text: plain((token as Tokens.Blockquote).tokens) }); break;
      case 'list': {
        const list = token as Tokens.List;
        blocks.push({ kind: 'list', ordered: list.ordered, items: list.items.map((i) => plain(i.tokens).trim()) });
        break;
      }
      case 'code': blocks.push({ kind: 'code', text: (token as Tokens.Code).text }); break;
      case 'table': {
        const table = token as Tokens.Table;
        const row = (cells: Tokens.TableCell[]) => cells.map((c) => plain(c.tokens)).join(' | ');
        blocks.push({ kind: 'code', text: [row(table.header), ...table.rows.map(row)].join('\n') });
        break;
      }
      default: break; // space, hr and raw html carry no text for the reader
    }
  }
  return blocks.filter((b) => b.kind === 'list' || b.text.trim() !== '');
}

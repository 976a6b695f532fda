import { Lexer, type Token, type Tokens } from 'marked';

/** A block of narrative as the PDF sets it: plain text only, no markup and no raw HTML. */
export type TextBlock =
  | { kind: 'heading'; text: string }
  | { kind: 'paragraph'; text: string }
  | { kind: 'list'; ordered: boolean; items: string[] }
  | { kind: 'code'; text: string };

/** Inline tokens to plain text; raw HTML is dropped, links keep their address in brackets. */
function plain(tokens: Token[] | undefined): string {
  if (!tokens) return '';
  return tokens.map((t) => {
    switch (t.type) {
      case 'html': return '';
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

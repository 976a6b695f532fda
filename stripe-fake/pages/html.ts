/** Escapes text for HTML element content and quoted attribute values. */
export function escapeHtml(value: unknown): string {
  return String(value)
    .replaceAll('&', '&amp;')
    .replaceAll('<', '&lt;')
    .replaceAll('>', '&gt;')
    .replaceAll('"', '&quot;')
    .replaceAll("'", '&#39;');
}

/** Marks text as already-safe HTML so the `html` tag does not escape it again. */
export class SafeHtml {
  constructor(readonly value: string) {}
  toString(): string {
    return this.value;
  }
}

/** Template tag: interpolated values are escaped unless they are SafeHtml (or arrays of it). */
export function html(strings: TemplateStringsArray, ...values: unknown[]): SafeHtml {
  const render = (value: unknown): string => {
    if (value instanceof SafeHtml) return value.value;
    if (Array.isArray(value)) return value.map(render).join('');
    if (value === null || value === undefined || value === false) return '';
    return escapeHtml(value);
  };
  return new SafeHtml(strings.reduce((out, text, i) => out + text + (i < values.length ? render(values[i]) : ''), ''));
}

const STYLE = `
  :root { color-scheme: light; --ink: #1d2733; --muted: #5b6775; --line: #d5dbe1; --accent: #2f5d7c; --bad: #a4262c; }
  * { box-sizing: border-box; }
  body { margin: 0; min-height: 100vh; display: grid; place-items: center; background: #eef2f5;
         font: 15px/1.45 system-ui, -apple-system, "Segoe UI", sans-serif; color: var(--ink); }
  main { width: min(440px, 94vw); background: #fff; border: 1px solid var(--line); border-radius: 10px; padding: 24px 26px; }
  .mode { display: inline-block; font-size: 12px; letter-spacing: .04em; text-transform: uppercase; color: #7a4b00;
          background: #fff3d6; border-radius: 4px; padding: 2px 8px; margin-bottom: 12px; }
  h1 { font-size: 20px; margin: 0 0 4px; }
  .muted { color: var(--muted); }
  table { width: 100%; border-collapse: collapse; margin: 14px 0; }
  td { padding: 6px 0; border-bottom: 1px solid var(--line); }
  td.amount { text-align: right; white-space: nowrap; }
  tr.total td { font-weight: 600; border-bottom: none; }
  label { display: block; font-size: 13px; color: var(--muted); margin: 12px 0 4px; }
  input { width: 100%; font: inherit; padding: 9px 10px; border: 1px solid var(--line); border-radius: 6px; }
  .row { display: grid; grid-template-columns: 1fr 1fr; gap: 12px; }
  button { width: 100%; margin-top: 18px; padding: 11px; font: inherit; font-weight: 600; color: #fff;
           background: var(--accent); border: 0; border-radius: 6px; cursor: pointer; }
  .error { color: var(--bad); background: #fdecec; border: 1px solid #f3c2c4; border-radius: 6px; padding: 10px 12px; margin: 12px 0; }
  .note { font-size: 13px; color: var(--muted); margin-top: 14px; }
  a { color: var(--accent); }
`;

/** A whole page: no scripts, no external assets. */
export function page(title: string, body: SafeHtml): string {
  return html`<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${title}</title><style>${new SafeHtml(STYLE)}</style></head>
<body><main>${body}</main></body></html>`.value;
}

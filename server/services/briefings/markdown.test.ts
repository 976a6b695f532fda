import { describe, expect, it } from 'vitest';
import { renderMarkdown } from './markdown';

describe('renderMarkdown', () => {
  it('renders ordinary Markdown', () => {
    const html = renderMarkdown('# Findings\n\nAdded melt is **largest** in *July*.\n\n- one\n- two\n\n[Report](https://example.org/r)');
    expect(html).toContain('<h3>Findings</h3>');
    expect(html).toContain('<strong>largest</strong>');
    expect(html).toContain('<li>one</li>');
    expect(html).toContain('href="https://example.org/r"');
    expect(html).toContain('rel="noopener noreferrer nofollow"');
  });

  it('drops script tags with their content', () => {
    const html = renderMarkdown('Before\n\n<script>alert("x")</script>\n\nAfter <script src="https://evil.example/x.js"></script>');
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toContain('alert(');
    expect(html).toContain('Before');
    expect(html).toContain('After');
  });

  it('strips event handlers and unsafe tags', () => {
    const html = renderMarkdown('<img src=x onerror="alert(1)"> <p onclick="steal()">Hi</p> <iframe src="https://evil.example"></iframe> <svg onload="alert(2)"></svg>');
    expect(html).not.toMatch(/onerror|onclick|onload|<img|<iframe|<svg/i);
    expect(html).toContain('Hi');
  });

  it('makes javascript: and data: links inert', () => {
    const html = renderMarkdown('[click](javascript:alert(1)) [raw](<JaVaScRiPt:alert(2)>) <a href="javascript:alert(3)">x</a> [d](data:text/html;base64,PHNjcmlwdD4=)');
    expect(html).not.toMatch(/javascript:/i);
    expect(html).not.toMatch(/data:text/i);
    expect(html).toContain('click');
  });

  it('keeps code as text, escaped', () => {
    const html = renderMarkdown('`<script>alert(1)</script>`');
    expect(html).toContain('&lt;script&gt;');
    expect(html).not.toMatch(/<script/i);
  });
});

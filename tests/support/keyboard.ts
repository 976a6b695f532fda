/// <reference lib="dom" />
import type { Page } from 'playwright-core';

/**
 * Presses Tab (or Shift+Tab) until the focused element matches `selector` (or sits inside a match),
 * as a keyboard user moves through the page; fails after `limit` presses.
 */
export async function tabTo(page: Page, selector: string, { limit = 80, backwards = false } = {}): Promise<void> {
  for (let i = 0; i < limit; i++) {
    const there = await page.evaluate((s) => Boolean(document.activeElement?.closest(s)), selector);
    if (there) return;
    await page.keyboard.press(backwards ? 'Shift+Tab' : 'Tab');
  }
  const at = await page.evaluate(() => document.activeElement?.outerHTML.slice(0, 160));
  throw new Error(`Tab never reached ${selector} (focus on ${at})`);
}

/** Whether the focused element matches `selector` or sits inside a match. */
export const focusIsIn = (page: Page, selector: string) => page.evaluate((s) => Boolean(document.activeElement?.closest(s)), selector);

/**
 * The focus indicator of the element with the focus, as "outline 3px solid rgb(…)" or "shadow …";
 * "none" when nothing shows where the focus is.
 */
export const focusIndicator = (page: Page) => page.evaluate(() => {
  const el = document.activeElement;
  if (!el || el === document.body) return 'none (nothing focused)';
  const style = getComputedStyle(el);
  if (style.outlineStyle !== 'none' && parseFloat(style.outlineWidth) > 0) return `outline ${style.outlineWidth} ${style.outlineStyle} ${style.outlineColor}`;
  if (style.boxShadow !== 'none') return `shadow ${style.boxShadow}`;
  return `none on <${el.tagName.toLowerCase()} class="${el.className}">`;
});

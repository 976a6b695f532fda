/// <reference lib="dom" />
import type { AddressInfo } from 'node:net';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { createTestApp, type TestApp } from './test-app';

export interface BrowserSession {
  baseUrl: string;
  t: TestApp;
  context: BrowserContext;
  newPage(): Promise<Page>;
  close(): Promise<void>;
}

// Flags for Debian's Chromium in this closed network (docs/conventions.md, "Set-up facts the tests rely on").
const CHROMIUM_ARGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
];

export interface BrowserWindow {
  context: BrowserContext;
  newPage(): Promise<Page>;
  close(): Promise<void>;
}

/** Headless Chromium with a fresh profile, for an app already listening (pages start signed out, without animation). */
export async function launchBrowser(): Promise<BrowserWindow> {
  const profile = mkdtempSync(path.join(tmpdir(), 'tarnish-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: CHROMIUM_ARGS,
    viewport: { width: 1280, height: 860 },
    // The browser's language is the default display locale: British English, as the tests read it.
    locale: 'en-GB',
  });
  return {
    context,
    newPage: async () => {
      // One browser profile for the file: each page starts signed out.
      await context.clearCookies();
      const page = await context.newPage();
      // Charts and transitions still: screenshots and clicks see the final state.
      await page.addInitScript(() => {
        (window as unknown as { __TARNISH_NO_ANIMATION__: boolean }).__TARNISH_NO_ANIMATION__ = true;
      });
      page.on('load', () => {
        void page.addStyleTag({ content: '*,*::before,*::after{transition:none!important;animation:none!important}' }).catch(() => undefined);
      });
      return page;
    },
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * Resolves once the page has drawn what it shows: web fonts loaded and two animation frames gone
 * by (ECharts paints a chart on the frame after its canvas appears; transitions are off in tests).
 * Use it before a screenshot instead of a fixed sleep.
 */
export async function settled(page: Page): Promise<void> {
  await page.evaluate(async () => {
    await document.fonts.ready;
    await new Promise<void>((resolve) => requestAnimationFrame(() => requestAnimationFrame(() => resolve())));
  });
}

/** Serves the built client (dist/) and API on a free port and opens headless Chromium on it. */
export async function openBrowser(): Promise<BrowserSession> {
  const t = createTestApp({ CLIENT_DIR: 'dist' });
  const server = t.app.listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', () => resolve()));
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const browser = await launchBrowser();
  return {
    baseUrl,
    t,
    context: browser.context,
    newPage: browser.newPage,
    close: async () => {
      await browser.close();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await t.close();
    },
  };
}

/** Signs in through the form and waits for the overview. */
export async function signInThroughForm(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.fill('[data-test=email]', email);
  await page.fill('[data-test=password]', password);
  await page.click('[data-test=sign-in]');
  await page.waitForSelector('[data-test=main-nav]');
}

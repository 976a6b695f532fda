import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seed } from '../../seeds/01_demo_organisation';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { openBrowser, signInThroughForm, type BrowserSession } from '../support/browser';

let b: BrowserSession;

beforeAll(async () => {
  b = await openBrowser();
  await seed(b.t.db);
});
afterAll(() => b?.close());

// What each role's left navigation must show (and nothing more).
const EXPECTED_NAV: Record<string, string[]> = {
  admin: ['overview', 'catchments', 'lab', 'studies', 'briefings', 'queue', 'team', 'billing'],
  consultant: ['overview', 'catchments', 'lab', 'studies', 'briefings'],
  scientist: ['overview', 'catchments', 'lab', 'studies'],
  client: ['overview', 'briefings'],
};

describe('signing in in the browser', () => {
  it.each(DEMO_ACCOUNTS.map((a) => [a.role, a] as const))('shows the %s their own navigation', async (role, account) => {
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, account.email, account.password);
    const items = await page.$$eval('[data-test=main-nav] [data-test^=nav-]', (els) => els.map((e) => e.getAttribute('data-test')!.slice(4)));
    expect(items.sort()).toEqual([...EXPECTED_NAV[role]].sort());
    expect(await page.textContent('[data-test=user-menu]')).toContain(account.name);
    await page.screenshot({ path: `test-results/sign-in-${role}.png` });
    await page.close();
  });

  it('shows a clear message for bad credentials and stays on sign-in', async () => {
    const page = await b.newPage();
    await page.goto(`${b.baseUrl}/sign-in`);
    await page.fill('[data-test=email]', DEMO_ACCOUNTS[1].email);
    await page.fill('[data-test=password]', 'definitely the wrong password');
    await page.click('[data-test=sign-in]');
    const banner = await page.waitForSelector('[data-test=form-error]');
    expect(await banner.textContent()).toContain('E-mail or password is not right.');
    expect(page.url()).toContain('/sign-in');
    await page.close();
  });

  it('sends a client who types an admin address to the overview with a notice', async () => {
    const client = DEMO_ACCOUNTS.find((a) => a.role === 'client')!;
    const page = await b.newPage();
    await signInThroughForm(page, b.baseUrl, client.email, client.password);
    await page.goto(`${b.baseUrl}/billing`);
    await page.waitForSelector('text=Your role does not give access to that page.');
    expect(new URL(page.url()).pathname).toBe('/');
    await page.close();
  });
});

import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { SIGN_UP_REPLY } from '../../shared/schemas/auth';
import { launchBrowser, settled, signInThroughForm } from '../support/browser';
import { createOrganisation, TEST_PASSWORD, unique } from '../support/factories';
import { withTeamBrowser } from '../support/team-browser';

const f = withTeamBrowser();

const shot = async (page: Page, name: string) => {
  await settled(page);
  await page.screenshot({ path: `test-results/account-${name}.png`, fullPage: true });
};

async function signUp(page: Page, email: string): Promise<string> {
  await page.goto(`${f.h.baseUrl}/sign-up`);
  await page.fill('[data-test=organisation]', 'Glenmoor Water Studies');
  await page.fill('[data-test=name]', 'Rhona Vey');
  await page.fill('[data-test=email]', email);
  await page.fill('[data-test=password]', 'cairn heather sleet 2044');
  await page.click('[data-test=sign-up]');
  return (await page.locator('[data-test=sign-up-sent]').textContent())!;
}

describe('accounts in the browser', () => {
  it('answers a sign-up the same for a new and a taken address, and the mailed link finishes the new account', async () => {
    const page = await f.browser.newPage();
    const fresh = `${unique('founder')}@glenmoor.example`;
    expect(await signUp(page, f.org.users.consultant.email)).toBe(SIGN_UP_REPLY);
    await shot(page, 'sign-up-sent');
    expect(await signUp(page, fresh)).toBe(SIGN_UP_REPLY);

    const note = await f.h.catcher.waitFor((m) => m.to.includes(f.org.users.consultant.email));
    expect(note.subject).toContain('already has');
    const mail = await f.h.catcher.waitFor((m) => m.to.includes(fresh));
    const link = /(http\S+\/confirm-sign-up\?token=[A-Za-z0-9_-]{43})/.exec(mail.text)![1]!;
    await page.goto(link);
    await page.waitForSelector('[data-test=main-nav]');
    expect(await page.textContent('[data-test=user-menu]')).toContain('Rhona Vey');
    await shot(page, 'signed-up');
    await page.close();
  });

  it('changes the password from the user menu: wrong and breached ones refused, other sessions ended', async () => {
    const mine = await createOrganisation(f.h.t.db);
    // Another browser (a profile of its own), signed in as the same person.
    const secondBrowser = await launchBrowser();
    const elsewhere = await secondBrowser.newPage();
    await signInThroughForm(elsewhere, f.h.baseUrl, mine.users.scientist.email, TEST_PASSWORD);
    const page = await f.browser.newPage();
    await signInThroughForm(page, f.h.baseUrl, mine.users.scientist.email, TEST_PASSWORD);
    await page.click('[data-test=user-menu]');
    await page.click('[data-test=account]');

    await page.fill('[data-test=current-password]', 'not my password');
    await page.fill('[data-test=new-password]', 'moraine lichen quartz 1987');
    await page.click('[data-test=change-password]');
    await page.waitForSelector('text=This is not your current password.');

    await page.fill('[data-test=current-password]', TEST_PASSWORD);
    await page.fill('[data-test=new-password]', 'qwertyuiop123');
    await page.click('[data-test=change-password]');
    await page.waitForSelector('text=published lists of breached passwords');
    await shot(page, 'password-refused');

    await page.fill('[data-test=new-password]', 'moraine lichen quartz 1987');
    await page.click('[data-test=change-password]');
    await page.waitForSelector('[data-test=password-changed]');
    await shot(page, 'password-changed');
    // This browser stays signed in; the other one is sent to sign in again.
    await page.reload();
    await page.waitForSelector('[data-test=main-nav]');
    await elsewhere.reload();
    await elsewhere.waitForURL((url) => url.pathname.includes('/sign-in'));
    await page.close();
    await secondBrowser.close();
  });
});

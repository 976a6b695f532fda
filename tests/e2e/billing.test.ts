import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { signInThroughForm } from '../support/browser';
import { TEST_PASSWORD, unique } from '../support/factories';
import { withTeamBrowser } from '../support/team-browser';

const f = withTeamBrowser();

const shot = (page: Page, name: string) => page.screenshot({ path: `test-results/billing-${name}.png`, fullPage: true });

describe('seats and team in the browser', () => {
  it('buys seats through the checkout page, adds 3 more, invites a consultant and the mail arrives', async () => {
    const page = await f.browser.newPage();
    await signInThroughForm(page, f.h.baseUrl, f.org.users.admin.email, TEST_PASSWORD);

    // No plan yet: the page says what is blocked and offers one.
    await page.click('[data-test=nav-billing]');
    await page.waitForSelector('[data-test=subscription-inactive]');
    await page.waitForSelector('[data-test=buy-card]');
    await shot(page, 'no-plan');
    await page.fill('[data-test=buy-seats]', '3');
    await page.click('[data-test=buy-checkout]');

    // The payment fake's own card page.
    await page.waitForSelector('#card_number');
    expect(page.url()).toContain(`${f.h.fake.url}/hosted/checkout/`);
    await page.fill('#card_number', '4242 4242 4242 4242');
    await page.fill('#expiry', '12 / 34');
    await page.fill('#cvc', '123');
    await page.fill('#name', 'Test Admin');
    await shot(page, 'checkout-page');
    await page.click('button[type=submit]');

    // Back on our page once the webhook has made the plan active.
    await page.waitForSelector('[data-test=plan-card]', { timeout: 20_000 });
    expect(await page.textContent('[data-test=plan-seats]')).toBe('3');
    expect(await page.textContent('[data-test=plan-in-use]')).toBe('3');

    // All seats are taken: inviting a consultant is refused with an offer to add seats.
    const consultant = `${unique('consultant')}@test.example`;
    await page.click('[data-test=nav-team]');
    await page.waitForSelector('[data-test=members-table]');
    await page.click('[data-test=open-invite]');
    await page.fill('[data-test=invite-name]', 'Edda Kveld');
    await page.fill('[data-test=invite-email]', consultant);
    await page.click('[data-test=invite-send]');
    await page.waitForSelector('[data-test=invite-add-seats]');
    expect(await page.textContent('[data-test=invite-error]')).toContain('All 3 paid seats are taken');
    await page.click('[data-test=invite-add-seats]');

    // Three more seats, charged to the saved card.
    await page.waitForSelector('[data-test=resize-seats]');
    await page.fill('[data-test=resize-seats]', '6');
    await page.click('[data-test=resize-submit]');
    // The prorated price first, from the payment service's preview; nothing changes until confirmed.
    const price = await page.waitForSelector('[data-test=resize-price]');
    expect(await price.innerText()).toMatch(/3 more seat\(s\) for the rest of this period: €\d+\.\d\d charged now/);
    expect(await page.locator('[data-test=resize-confirm-button]').innerText()).toMatch(/Pay €\d+\.\d\d and change/i);
    await shot(page, 'seat-change-confirmation');
    expect(await page.locator('[data-test=plan-seats]').innerText()).toBe('3');
    await page.click('[data-test=resize-confirm-button]');
    await page.waitForFunction(() => document.querySelector('[data-test=plan-seats]')?.textContent === '6');
    await page.waitForFunction(() => document.querySelectorAll('[data-test=invoice-table] tbody tr').length >= 2);
    await shot(page, 'seats-and-billing');

    await page.click('[data-test=nav-team]');
    await page.click('[data-test=open-invite]');
    await page.fill('[data-test=invite-name]', 'Edda Kveld');
    await page.fill('[data-test=invite-email]', consultant);
    await page.click('[data-test=invite-send]');
    await page.waitForFunction((email) => document.querySelector('[data-test=members-table]')?.textContent?.includes(email), consultant);
    expect(await page.textContent('[data-test=seat-usage]')).toContain('4 of 6');
    await shot(page, 'team');

    // The mail reached the catcher; the development inbox shows it with its link.
    const mail = await f.h.catcher.waitFor((m) => m.to.includes(consultant));
    expect(mail.text).toContain(`${f.h.baseUrl}/invitation?token=`);
    await page.goto(`${f.h.baseUrl}/dev/inbox`);
    // The newest mail is shown opened, with its link.
    const inboxLink = page.locator('[data-test=inbox-message]').first().locator('a[href*="/invitation?token="]');
    await inboxLink.waitFor();
    expect(await page.locator('[data-test=inbox-message]').first().textContent()).toContain(consultant);
    const link = (await inboxLink.getAttribute('href'))!;
    expect(mail.text).toContain(link);
    await shot(page, 'dev-inbox');

    // The invited consultant follows the link, chooses a password and can sign in.
    const invited = await f.browser.newPage();
    await invited.goto(link);
    await invited.waitForSelector('[data-test=invitation-preview]');
    await shot(invited, 'accept-invitation');
    await invited.fill('[data-test=accept-password]', 'glacier tongue retreat 2026');
    await invited.click('[data-test=accept-submit]');
    await invited.waitForSelector('[data-test=invitation-done]');
    await signInThroughForm(invited, f.h.baseUrl, consultant, 'glacier tongue retreat 2026');
    await invited.close();
    await page.close();
  });

  it('resets a forgotten password from the sign-in page through the mailed link', async () => {
    const page = await f.browser.newPage();
    const email = f.org.users.scientist.email;
    await page.goto(`${f.h.baseUrl}/sign-in`);
    await page.waitForSelector('[data-test=forgot-password]');
    await shot(page, 'sign-in');
    await page.click('[data-test=forgot-password]');
    await page.fill('[data-test=reset-email]', email);
    await page.click('[data-test=reset-send]');
    await page.waitForSelector('[data-test=reset-sent]');
    const mail = await f.h.catcher.waitFor((m) => m.to.includes(email) && m.subject.includes('password'));
    const link = /http:\/\/\S+\/reset-password\?token=\S+/.exec(mail.text)![0];
    await page.goto(link);
    await page.fill('[data-test=reset-password]', 'moraine dust on the firn line');
    await page.click('[data-test=reset-submit]');
    await page.waitForSelector('[data-test=reset-done]');
    await shot(page, 'reset-done');
    await signInThroughForm(page, f.h.baseUrl, email, 'moraine dust on the firn line');
    await page.close();
  });
});

/**
 * Accounts end to end in Chromium: sign up, sign in, create a farm, invite a partner, open the
 * captured e-mail on the dev outbox page, accept the invitation in a second browser, and see the
 * farm as that partner; then the reset, profile and administrator screens. Expected behaviour:
 * docs/product.md (Accounts). Screenshots of each screen are saved.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, signInThroughForm, startBrowserHarness, type BrowserHarness } from '../helpers/browser.js';

const OWNER = { name: 'Ailsa Brockway', email: 'ailsa.brockway@example.test', password: 'high-pasture-2031' };
const PARTNER = { name: 'Rune Brockway', email: 'rune.brockway@example.test', password: 'low-meadow-2032' };
const FARM = 'Brockway Hill Farm';

/** Polls with room for a busy machine (shared CI cores): the default 1 s is too tight here. */
const poll = <T>(fn: () => T | Promise<T>) => expect.poll(fn, { timeout: 20_000, interval: 100 });

async function openMailLink(page: Page, to: string, linkPart: string): Promise<void> {
  await page.goto('/dev/outbox');
  const mail = page.locator('article.mail', { hasText: to }).first();
  await poll(() => mail.count()).toBe(1);
  await mail.locator(`a.mail-link[href*="${linkPart}"]`).first().click();
}

describe('accounts in the browser', () => {
  let harness: BrowserHarness;
  beforeAll(async () => {
    harness = await startBrowserHarness();
  });
  afterAll(async () => {
    await harness?.close();
  });

  it('signs up, creates a farm, invites a partner who accepts in another browser and sees the farm', async () => {
    const owner = await (await harness.newContext()).newPage();

    // Sign-up with inline messages from the shared schema before anything is sent.
    await owner.goto('/sign-up');
    await owner.getByRole('button', { name: 'Create account' }).click();
    await poll(() => owner.locator('#name-error').textContent()).toBe('Name is required');
    await owner.getByLabel('E-mail').fill(OWNER.email);
    await owner.locator('#password').fill(OWNER.email);
    await owner.getByRole('button', { name: 'Create account' }).click();
    await poll(() => owner.locator('#password-error').textContent()).toBe('Password must not be your e-mail address');
    await harness.screenshot(owner, 'accounts-sign-up-errors');
    await owner.getByLabel('Your name').fill(OWNER.name);
    await owner.locator('#password').fill(OWNER.password);
    await owner.getByRole('button', { name: 'Create account' }).click();
    await owner.waitForURL('**/farms');
    await poll(() => owner.getByText('You are not on any farm yet').count()).toBe(1);
    await harness.screenshot(owner, 'accounts-farms-empty');

    // Sign out through the user menu, then sign in again through the form.
    await owner.getByRole('button', { name: OWNER.name }).click();
    await owner.getByRole('menuitem', { name: 'Sign out' }).click();
    await owner.waitForURL((url) => url.pathname === '/');
    await owner.goto('/sign-in');
    await harness.screenshot(owner, 'accounts-sign-in');
    await signInThroughForm(owner, OWNER.email, OWNER.password);

    // Create a farm.
    await owner.getByRole('button', { name: 'New farm' }).click();
    await owner.getByRole('button', { name: 'Create farm' }).click();
    await poll(() => owner.locator('#farm-name-error').textContent()).toBe('Farm name is required');
    await owner.getByLabel('Farm name').fill(FARM);
    await owner.getByLabel('Location').fill('Upper Dunnock (invented)');
    await harness.screenshot(owner, 'accounts-create-farm');
    await owner.getByRole('button', { name: 'Create farm' }).click();
    await owner.waitForURL(/\/farms\/\d+$/);
    const farmId = Number(new URL(owner.url()).pathname.split('/').pop());

    // Invite a partner from the members screen.
    await owner.goto(`/farms/${farmId}/members`);
    await poll(() => owner.getByRole('heading', { name: 'Members' }).count()).toBe(1);
    await owner.getByLabel('E-mail').fill('not-an-address');
    await owner.getByRole('button', { name: 'Send invitation' }).click();
    await poll(() => owner.locator('#invite-email-error').textContent()).toBe('Enter a valid e-mail address');
    await owner.getByLabel('E-mail').fill(PARTNER.email);
    await owner.getByRole('button', { name: 'Send invitation' }).click();
    await poll(() => owner.locator('td', { hasText: PARTNER.email }).count()).toBe(1);
    await harness.screenshot(owner, 'accounts-members-invited');

    // The partner, at another computer, opens the e-mail and accepts.
    const partner = await (await harness.newContext()).newPage();
    await partner.goto('/dev/outbox');
    await poll(() => partner.locator('article.mail', { hasText: PARTNER.email }).count()).toBe(1);
    await harness.screenshot(partner, 'accounts-outbox');
    await openMailLink(partner, PARTNER.email, '/invitations/');
    await partner.waitForURL(/\/invitations\//);
    await poll(() => partner.getByText(`join ${FARM}`, { exact: false }).count()).toBeGreaterThan(0);
    await harness.screenshot(partner, 'accounts-accept-invitation');
    await partner.getByLabel('Your name').fill(PARTNER.name);
    await partner.locator('#password').fill(PARTNER.password);
    await partner.getByRole('button', { name: 'Create account and join' }).click();
    await partner.waitForURL(new RegExp(`/farms/${farmId}$`));

    // The partner sees the farm, as a family partner, and the owner sees them as a member.
    await partner.goto('/farms');
    const card = partner.locator('li.farm', { hasText: FARM });
    await poll(() => card.count()).toBe(1);
    expect(await card.textContent()).toContain('Family partner');
    await harness.screenshot(partner, 'accounts-farms-as-partner');
    await owner.reload();
    await poll(() => owner.locator('td', { hasText: PARTNER.name }).count()).toBe(1);
    await poll(() => owner.getByText('None waiting.').count()).toBe(1);
    await harness.screenshot(owner, 'accounts-members');

    // Profile: change the name, inline error for a wrong current password.
    await owner.goto('/profile');
    await owner.getByLabel('Your name').fill('Ailsa B. Brockway');
    await owner.getByRole('button', { name: 'Save name' }).click();
    await poll(() => owner.getByRole('status').textContent()).toContain('Saved');
    await owner.locator('#current-password').fill('not-my-password');
    await owner.locator('#new-password').fill('another-field-2033');
    await owner.getByRole('button', { name: 'Change password' }).click();
    await poll(() => owner.locator('#current-password-error').textContent()).toBe('Current password is not right');
    await harness.screenshot(owner, 'accounts-profile');
  });

  it('resets a forgotten password through the e-mailed link', async () => {
    const page = await (await harness.newContext({ width: 820, height: 1100 })).newPage();
    await page.goto('/forgot-password');
    await page.getByLabel('E-mail').fill('partner@byrecast.test');
    await page.getByRole('button', { name: 'Send the link' }).click();
    await poll(() => page.getByText('If an account exists').count()).toBe(1);
    await harness.screenshot(page, 'accounts-forgot-password');

    await page.goto('/dev/outbox');
    await poll(() => page.locator('article.mail', { hasText: 'partner@byrecast.test' }).count()).toBe(1);
    await openMailLink(page, 'partner@byrecast.test', '/reset-password');
    await page.waitForURL(/\/reset-password\?token=/);
    await page.locator('#password').fill('short');
    await page.getByRole('button', { name: 'Save the new password' }).click();
    await poll(() => page.locator('#password-error').textContent()).toBe('Password must be at least 10 characters');
    await harness.screenshot(page, 'accounts-reset-password');
    await page.locator('#password').fill('renewed-password-44');
    await page.getByRole('button', { name: 'Save the new password' }).click();
    await poll(() => page.getByText('Your password is changed').count()).toBe(1);
    await harness.screenshot(page, 'accounts-reset-done');
    await signInThroughForm(page, 'partner@byrecast.test', 'renewed-password-44');
    // A partner on exactly one farm lands on it (docs/design.md, Flow: a farmer goes straight to their own farm).
    expect(new URL(page.url()).pathname).toMatch(/^\/farms\/\d+$/);
  });

  it('shows the consultant every client farm and the administrator every account, without farm data', async () => {
    const consultant = await (await harness.newContext()).newPage();
    await signInThroughForm(consultant, 'consultant@byrecast.test', DEMO_PASSWORD);
    await poll(() => consultant.locator('li.farm', { hasText: 'Cairnbrook Farm' }).count()).toBe(1);
    await harness.screenshot(consultant, 'accounts-farms-consultant');

    const admin = await (await harness.newContext()).newPage();
    await signInThroughForm(admin, 'admin@byrecast.test', DEMO_PASSWORD);
    await admin.getByRole('button', { name: 'Byrecast Admin' }).click();
    await admin.getByRole('menuitem', { name: 'Users' }).click();
    await admin.waitForURL('**/admin/users');
    await poll(() => admin.locator('td', { hasText: 'owner@byrecast.test' }).count()).toBe(1);
    expect(await admin.locator('main').textContent()).not.toContain('Cairnbrook');
    await harness.screenshot(admin, 'accounts-admin-users');
  });

  it('sends a signed-out visitor to sign in and back where they were going', async () => {
    const visitor = await (await harness.newContext()).newPage();
    await visitor.goto('/profile');
    await visitor.waitForURL((url) => url.pathname === '/sign-in' && url.searchParams.get('next') === '/profile');
    await visitor.getByLabel('E-mail').fill('lender@byrecast.test');
    await visitor.locator('#password').fill(DEMO_PASSWORD);
    await visitor.getByRole('button', { name: 'Sign in' }).click();
    await visitor.waitForURL('**/profile');
    await poll(() => visitor.getByRole('heading', { name: 'Profile' }).count()).toBe(1);
  });
});

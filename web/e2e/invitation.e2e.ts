import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, newContext, screenshot, signIn, watchErrors } from './support/browser';

describe('invitation in Chromium: admin invites, the mail arrives, the person sets a password', () => {
  let browser: Browser;
  let close: () => Promise<void>;
  beforeAll(async () => {
    ({ browser, close } = await launchBrowser());
  });
  afterAll(async () => close?.());

  it('runs from the Users screen through the Outbox to the first sign-in', async () => {
    const email = `invited.${Date.now()}@demo.test`;
    const admin = await (await newContext(browser)).newPage();
    const errors = watchErrors(admin);
    await signIn(admin, 'admin@demo.test');
    await admin.getByRole('navigation').getByRole('link', { name: 'Users', exact: true }).click();
    await admin.getByRole('button', { name: 'Invite someone' }).click();
    const dialog = admin.getByRole('dialog', { name: 'Invite someone' });
    await dialog.getByLabel('Name').fill('Noor Invited');
    await dialog.getByLabel('E-mail').fill(email);
    await dialog.getByRole('textbox', { name: 'Role' }).click();
    await admin.getByRole('option', { name: /designer/i }).click();
    await screenshot(admin, 'invitation-1-dialog');
    await dialog.getByRole('button', { name: 'Send invitation' }).click();
    await expect.poll(() => admin.getByText(email).count()).toBeGreaterThan(0);
    await screenshot(admin, 'invitation-2-pending');

    // The SMTP fake captured the mail; the Outbox shows it with its link.
    await admin.getByRole('navigation').getByRole('link', { name: 'Outbox', exact: true }).click();
    const mail = admin.getByRole('article', { name: /invited/i }).filter({ hasText: email });
    // Mail is sent after the invitation commits; refresh until the fake has it.
    await expect
      .poll(
        async () => {
          await admin.getByRole('button', { name: 'Refresh' }).click();
          await mail
            .first()
            .waitFor({ timeout: 2_000 })
            .catch(() => undefined);
          return mail.count();
        },
        { timeout: 20_000 },
      )
      .toBe(1);
    await screenshot(admin, 'invitation-3-outbox');
    const link = await mail.getByRole('link', { name: /\/invitation\// }).getAttribute('href');
    expect(link).toMatch(/\/invitation\/[A-Za-z0-9_-]{20,}$/);
    expect(errors).toEqual([]);

    // The invited person opens the link in a fresh browser, sets a password and is signed in.
    const person = await (await newContext(browser)).newPage();
    await person.goto(new URL(link!).pathname);
    await expect.poll(() => person.getByLabel('E-mail').inputValue()).toBe(email);
    await person.getByLabel('Your name').fill('Noor Invited');
    await person.getByLabel('Password', { exact: true }).fill('a-long-enough-password');
    await person.getByLabel('Password again').fill('a-long-enough-password');
    await screenshot(person, 'invitation-4-accept');
    await person.getByRole('button', { name: 'Set password and sign in' }).click();
    await person.waitForURL(/\/find/);
    // a designer has one screen: it fills the page, with the account in the header
    await expect.poll(() => person.getByRole('heading', { name: 'Find parts' }).count()).toBeGreaterThan(0);
    await expect.poll(() => person.getByRole('group', { name: 'Account' }).getByText('Noor Invited').count()).toBe(1);
    await screenshot(person, 'invitation-5-signed-in');

    // The link works once.
    const again = await (await newContext(browser)).newPage();
    await again.goto(new URL(link!).pathname);
    await expect.poll(() => again.getByText(/unknown, already used or expired/i).count()).toBeGreaterThan(0);
  });
});

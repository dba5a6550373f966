import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { seriousViolations } from '../support/axe.ts';
import { baseUrl, openBrowser, type BrowserSession } from '../support/browser.ts';
import {
  addMembership,
  createOrganization,
  createPerson,
  uniqueSuffix,
  type FixtureOrg,
  type FixturePerson,
} from '../support/fixtures.ts';
import { linkIn, waitForEmail } from '../support/maildev.ts';

// Issue 4's "done when": a person resets a forgotten password and signs in, in the browser alone.
describe('resetting a forgotten password in the browser', () => {
  const run = uniqueSuffix();
  const newPassword = 'base-emitter-junction-88';
  let org: FixtureOrg;
  let person: FixturePerson;
  let browser: BrowserSession;
  let page: Page;

  beforeAll(async () => {
    org = await createOrganization(`Plover Instruments ${run}`);
    person = await createPerson('Dara Quist', `plover-${run}.example`);
    await addMembership(org, person, ['author']);
    browser = await openBrowser();
    page = await browser.context.newPage();
  });

  afterAll(() => browser?.close());

  it('when the person asks for a reset, then the same confirmation shows for a known and an unknown address', async () => {
    for (const email of [`nobody.${run}@plover-${run}.example`, person.email]) {
      await page.goto(`${baseUrl()}/sign-in`);
      await page.getByRole('link', { name: 'Forgot your password?' }).click();
      await page.getByRole('heading', { level: 1, name: 'Forgot your password?' }).waitFor();
      expect(await seriousViolations(page)).toEqual([]);
      await page.getByRole('textbox', { name: 'E-mail' }).fill(email);
      await page.getByRole('button', { name: 'Send reset link' }).click();
      await page.getByRole('heading', { level: 1, name: 'Check your e-mail' }).waitFor();
      expect(await page.getByText(/If an account uses this address/).count()).toBe(1);
    }
  });

  it('when the person follows the e-mailed link and sets a new password, then they sign in with it', async () => {
    const mail = await waitForEmail(person.email, /reset/i);
    const link = linkIn(mail, /^\/reset-password$/);

    await page.goto(`${baseUrl()}${link.pathname}${link.search}`);
    await page.getByRole('heading', { level: 1, name: 'Choose a new password' }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByLabel('New password', { exact: true }).fill(newPassword);
    await page.getByLabel('Repeat the new password').fill(newPassword);
    await page.getByRole('button', { name: 'Set new password' }).click();
    await page.getByRole('heading', { level: 1, name: 'Password changed' }).waitFor();

    await page.getByRole('link', { name: 'Sign in with your new password' }).click();
    await page.getByRole('textbox', { name: 'E-mail' }).fill(person.email);
    await page.getByLabel('Password', { exact: true }).fill(person.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('alert').waitFor();

    await page.getByLabel('Password', { exact: true }).fill(newPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${baseUrl()}/o/${org.slug}`);
    await page.getByRole('heading', { level: 1, name: 'My queue' }).waitFor();
  });
});

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

// Issue 4's browser test: an admin invites a new checker, the e-mail arrives in maildev, the
// invitee joins in a second browser (its own cookies), sees only what a checker may do, and
// switching organization changes every list.
describe('inviting a checker who joins in a second browser', () => {
  const run = uniqueSuffix();
  const checker = {
    email: `checker.${run}@kestrel-${run}.example`,
    name: 'Kojo Asante',
    password: 'small-signal-gain-2026',
  };
  const stillPending = `approver.${run}@kestrel-${run}.example`;
  let kestrel: FixtureOrg;
  let heron: FixtureOrg;
  let admin: FixturePerson;
  let kestrelAuthor: FixturePerson;
  let heronAuthor: FixturePerson;
  let adminBrowser: BrowserSession;
  let inviteeBrowser: BrowserSession;
  let adminPage: Page;
  let inviteePage: Page;

  beforeAll(async () => {
    kestrel = await createOrganization(`Kestrel Analog ${run}`);
    heron = await createOrganization(`Heron Mixed-Signal ${run}`);
    admin = await createPerson('Ada Brandt', `kestrel-${run}.example`);
    kestrelAuthor = await createPerson('Bo Lindgren', `kestrel-${run}.example`);
    heronAuthor = await createPerson('Cyra Nwosu', `heron-${run}.example`);
    await addMembership(kestrel, admin, ['admin']);
    await addMembership(heron, admin, ['admin', 'manager']);
    await addMembership(kestrel, kestrelAuthor, ['author']);
    await addMembership(heron, heronAuthor, ['author']);

    adminBrowser = await openBrowser();
    inviteeBrowser = await openBrowser();
    adminPage = await adminBrowser.context.newPage();
    inviteePage = await inviteeBrowser.context.newPage();
  });

  afterAll(async () => {
    await adminBrowser?.close();
    await inviteeBrowser?.close();
  });

  async function signIn(page: Page, email: string, password: string) {
    await page.getByRole('textbox', { name: 'E-mail' }).fill(email);
    await page.getByLabel('Password', { exact: true }).fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
  }

  async function memberNames(page: Page): Promise<string[]> {
    await page.getByRole('table', { name: /^Members of/ }).waitFor();
    return page
      .getByRole('table', { name: /^Members of/ })
      .getByRole('rowheader')
      .allTextContents();
  }

  async function pendingAddresses(page: Page): Promise<string[]> {
    const section = page.getByRole('region', { name: 'Pending invitations' });
    await section
      .getByText(/@|No invitation is waiting/)
      .first()
      .waitFor();
    return section.getByRole('rowheader').allTextContents();
  }

  it('when the admin signs in, then the accessible sign-in page leads to an organization’s queue', async () => {
    await adminPage.goto(`${baseUrl()}/sign-in`);
    await adminPage.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    expect(await seriousViolations(adminPage)).toEqual([]);

    await signIn(adminPage, admin.email, admin.password);

    await adminPage.getByRole('heading', { level: 1, name: 'My queue' }).waitFor();
    expect(new URL(adminPage.url()).pathname).toMatch(
      new RegExp(`^/o/(${kestrel.slug}|${heron.slug})$`),
    );
    await expect.poll(() => adminPage.getByRole('banner').textContent()).toContain(admin.name);
  });

  it('when the admin invites a new checker, then the invitation is pending and its e-mail arrives in maildev', async () => {
    await adminPage.goto(`${baseUrl()}/o/${kestrel.slug}/members`);
    await adminPage.getByRole('heading', { level: 1, name: 'Members and invitations' }).waitFor();
    expect(await memberNames(adminPage)).toEqual(
      expect.arrayContaining([
        expect.stringContaining(admin.name),
        expect.stringContaining(kestrelAuthor.name),
      ]),
    );
    expect(await seriousViolations(adminPage)).toEqual([]);

    for (const [email, role] of [
      [checker.email, 'Checker'],
      [stillPending, 'Approver'],
    ] as const) {
      await adminPage.getByRole('textbox', { name: 'E-mail of the person to invite' }).fill(email);
      await adminPage
        .getByRole('group', { name: 'Roles' })
        .getByRole('checkbox', { name: role })
        .check();
      await adminPage.getByRole('button', { name: 'Send invitation' }).click();
      await adminPage.getByText(`Invitation sent to ${email}.`).waitFor();
    }

    await expect
      .poll(() => pendingAddresses(adminPage))
      .toEqual(expect.arrayContaining([checker.email, stillPending]));
    const mail = await waitForEmail(checker.email, /invited you/);
    expect(mail.subject).toContain(kestrel.name);
  });

  it('when the invitee opens the link in a second browser and sets name and password, then they land signed in', async () => {
    const mail = await waitForEmail(checker.email, /invited you/);
    const link = linkIn(mail, /^\/invitations\/.+/);

    await inviteePage.goto(`${baseUrl()}${link.pathname}`);
    await inviteePage.getByRole('heading', { level: 1, name: `Join ${kestrel.name}` }).waitFor();
    expect(await inviteePage.getByText(/Reviews submitted revisions/).count()).toBe(1);
    expect(await seriousViolations(inviteePage)).toEqual([]);

    await inviteePage.getByRole('textbox', { name: 'Your name' }).fill(checker.name);
    await inviteePage.getByLabel('Password', { exact: true }).fill(checker.password);
    await inviteePage.getByLabel('Repeat the password').fill(checker.password);
    await inviteePage.getByRole('button', { name: 'Create account and join' }).click();

    await inviteePage.waitForURL(`${baseUrl()}/o/${kestrel.slug}`);
    await inviteePage.getByRole('heading', { level: 1, name: 'My queue' }).waitFor();
    await expect.poll(() => inviteePage.getByRole('banner').textContent()).toContain(checker.name);
    const myRoles = inviteePage.getByRole('region', { name: 'Your roles here' });
    expect(await myRoles.getByRole('term').allTextContents()).toEqual(['Checker']);
  });

  it('when the checker opens the members page, then no admin action shows and the server refuses admin lists', async () => {
    await inviteePage.getByRole('banner').getByRole('link', { name: 'Members' }).click();
    await inviteePage.getByRole('heading', { level: 1, name: 'Members and invitations' }).waitFor();

    expect(await memberNames(inviteePage)).toEqual(
      expect.arrayContaining([
        expect.stringContaining(admin.name),
        expect.stringContaining(checker.name),
      ]),
    );
    expect(
      await inviteePage
        .getByRole('button', { name: /^(Change roles|Remove|Disable|Enable)/ })
        .count(),
    ).toBe(0);
    expect(await inviteePage.getByRole('heading', { name: 'Invite someone' }).count()).toBe(0);
    expect(await inviteePage.getByRole('heading', { name: 'Pending invitations' }).count()).toBe(0);

    const api = inviteeBrowser.context.request;
    expect((await api.get(`${baseUrl()}/api/orgs/${kestrel.id}/invitations`)).status()).toBe(403);
    expect((await api.get(`${baseUrl()}/api/orgs/${heron.id}/members`)).status()).toBe(404);
  });

  it('when the checker signs out and signs in again with the new password, then the organization’s queue opens', async () => {
    await inviteePage.getByRole('button', { name: 'Sign out' }).click();
    await inviteePage.waitForURL(`${baseUrl()}/sign-in`);

    await signIn(inviteePage, checker.email, checker.password);

    await inviteePage.waitForURL(`${baseUrl()}/o/${kestrel.slug}`);
    await inviteePage.getByRole('heading', { level: 1, name: 'My queue' }).waitFor();
  });

  it('when the admin switches organization, then the members and the invitations are the other organization’s', async () => {
    await adminPage.reload();
    await expect
      .poll(() => memberNames(adminPage))
      .toEqual(
        expect.arrayContaining([
          expect.stringContaining(checker.name),
          expect.stringContaining(kestrelAuthor.name),
        ]),
      );
    expect(await pendingAddresses(adminPage)).toEqual([stillPending]);

    await adminPage.getByRole('button', { name: `Organization: ${kestrel.name}` }).click();
    await adminPage
      .getByRole('list', { name: 'Your organizations' })
      .getByRole('link', { name: heron.name })
      .click();

    await adminPage.waitForURL(`${baseUrl()}/o/${heron.slug}/members`);
    await adminPage.getByRole('heading', { name: `Members of ${heron.name}` }).waitFor();
    const heronMembers = await memberNames(adminPage);
    expect(heronMembers).toEqual(
      expect.arrayContaining([expect.stringContaining(heronAuthor.name)]),
    );
    expect(heronMembers.join(' ')).not.toMatch(new RegExp(`${kestrelAuthor.name}|${checker.name}`));
    expect(await pendingAddresses(adminPage)).toEqual([]);

    await adminPage.getByRole('button', { name: `Organization: ${heron.name}` }).click();
    await adminPage
      .getByRole('list', { name: 'Your organizations' })
      .getByRole('link', { name: kestrel.name })
      .click();
    await adminPage.waitForURL(`${baseUrl()}/o/${kestrel.slug}/members`);
    await expect
      .poll(() => memberNames(adminPage))
      .toEqual(expect.arrayContaining([expect.stringContaining(kestrelAuthor.name)]));
  });
});

import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { formatValue, solveOperatingPoint, type CircuitInput } from '@biasproof/calc';
import { seriousViolations } from '../support/axe.ts';
import { baseUrl } from '../support/browser.ts';
import {
  addMembership,
  createOrganization,
  createPerson,
  uniqueSuffix,
  type FixtureOrg,
  type FixturePerson,
} from '../support/fixtures.ts';
import { resultAt, screenshotDir, signIn } from '../support/worksheet-editor.ts';

/** A diode fed from 5 V through R1 (example values only). */
const circuit: CircuitInput = {
  title: 'Clamp bias',
  elements: [
    { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 5 },
    { kind: 'R', name: 'R1', nodes: ['in', 'out'], value: 1000 },
    { kind: 'D', name: 'D1', nodes: ['out', '0'], model: 'DSIG' },
  ],
  models: [{ name: 'DSIG', kind: 'D', params: { IS: 1e-14, N: 1 } }],
};
const TITLE = 'Clamp bias, channel B';

/**
 * Four people, each in a browser context of their own (own cookies), in one Chromium: Debian's,
 * launched like support/browser.ts does, with playwright's own fresh temporary profile.
 */
interface Person {
  who: FixturePerson;
  context: BrowserContext;
  page: Page;
}

// Issue 7's browser test: author, checker, approver and manager take one worksheet through
// the whole review, each in their own browser context, ending with the signature's
// manifestation on the worksheet page and in the manager's audit log.
describe('four people review and sign off a worksheet in the browser', () => {
  const run = uniqueSuffix();
  const domain = `tamarack-${run}.example`;
  let org: FixtureOrg;
  let browser: Browser;
  const people = {} as Record<'author' | 'checker' | 'approver' | 'manager', Person>;
  let worksheetUrl: string;
  /** Uncaught errors in any of the four pages: there should be none. */
  const pageErrors: string[] = [];
  const dir = screenshotDir();

  beforeAll(async () => {
    org = await createOrganization(`Tamarack Analog ${run}`);
    const cast = [
      ['author', 'Maren Holt', ['author']],
      ['checker', 'Jonas Eriksen', ['checker']],
      ['approver', 'Adaeze Obi', ['approver']],
      ['manager', 'Ruth Calder', ['manager']],
    ] as const;
    browser = await chromium.launch({
      executablePath: '/usr/bin/chromium',
      headless: true,
      args: [
        '--headless',
        '--no-sandbox',
        '--disable-gpu',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--no-first-run',
      ],
    });
    for (const [role, name, roles] of cast) {
      const who = await createPerson(name, domain);
      await addMembership(org, who, [...roles]);
      const context = await browser.newContext({ viewport: { width: 1600, height: 1000 } });
      const page = await context.newPage();
      page.on('pageerror', (e) => pageErrors.push(`${role}: ${e.message}`));
      await signIn(page, who.email, who.password, org.slug);
      people[role] = { who, context, page };
    }
  });

  afterAll(async () => {
    await browser?.close();
  });

  const steps = (page: Page) => page.getByRole('list', { name: 'Workflow steps' });
  const reviewPanel = (page: Page) => page.getByRole('region', { name: 'Review' });
  async function confirmStep(page: Page, button: string, dialogName: RegExp, comment?: string) {
    await steps(page).getByRole('button', { name: button, exact: true }).click();
    const dialog = page.getByRole('dialog', { name: dialogName });
    if (comment) await dialog.getByLabel(/^Comment/).fill(comment);
    await dialog
      .getByRole('button', { name: button === 'Accept' ? 'Accept revision' : button })
      .click();
    await dialog.waitFor({ state: 'detached' });
  }
  async function fromQueue(page: Page, section: string, screenshot?: string) {
    await page.goto(`${baseUrl()}/o/${org.slug}`);
    const list = page.getByRole('region', { name: section });
    const link = list.getByRole('link', { name: TITLE });
    await link.waitFor();
    if (screenshot) {
      expect(await seriousViolations(page)).toEqual([]);
      await page.screenshot({ path: join(dir, screenshot), fullPage: true });
    }
    await link.click();
    await page.getByRole('heading', { level: 1, name: TITLE }).waitFor();
    expect(page.url()).toBe(worksheetUrl);
  }

  it('when the author assigns the checker and approver and submits, then the worksheet is in check', async () => {
    const { page } = people.author;
    // Arrange: the project and worksheet through the API the editor uses (issue 5 tests the editor).
    const { token } = (await (await page.request.get(`${baseUrl()}/api/auth/csrf`)).json()) as {
      token: string;
    };
    const headers = { 'x-csrf-token': token };
    const project = (await (
      await page.request.post(`${baseUrl()}/api/orgs/${org.id}/projects`, {
        headers,
        data: { name: 'Input protection', code: `IP${run.slice(0, 4)}` },
      })
    ).json()) as { id: string };
    const worksheet = (await (
      await page.request.post(`${baseUrl()}/api/orgs/${org.id}/worksheets`, {
        headers,
        data: { projectId: project.id, title: TITLE, circuit },
      })
    ).json()) as { id: string };
    worksheetUrl = `${baseUrl()}/o/${org.slug}/worksheets/${worksheet.id}`;

    await page.goto(worksheetUrl);
    await page.getByRole('heading', { level: 1, name: TITLE }).waitFor();
    const submit = steps(page).getByRole('button', { name: 'Submit for check' });
    expect(await submit.isDisabled()).toBe(true);
    await page
      .getByText('Assign a checker and an approver before submitting this worksheet.')
      .waitFor();

    await page.getByRole('button', { name: 'Assign checker and approver' }).click();
    const assign = page.getByRole('dialog', { name: 'Checker and approver' });
    await assign.getByLabel('Checker').selectOption({ label: 'Jonas Eriksen' });
    await assign.getByLabel('Approver').selectOption({ label: 'Adaeze Obi' });
    await assign.getByRole('button', { name: 'Save assignment' }).click();
    await page.getByText('The checker and approver are saved.').waitFor();
    await expect.poll(() => submit.isEnabled()).toBe(true);
    expect(await seriousViolations(page)).toEqual([]);

    await confirmStep(page, 'Submit for check', /Submit revision A for check/);
    await page.getByText('Revision A was submitted for check.').waitFor();
    await page.getByText('Read only. This worksheet is in check').waitFor();
  });

  it('when the checker clicks a number and returns the revision with a major finding, then accept was blocked by it', async () => {
    const { page } = people.checker;
    await fromQueue(page, 'To check', 'review-queue-checker.png');
    const engine = solveOperatingPoint(circuit);
    const d1 = engine.devices.d1;
    if (d1?.kind !== 'D') throw new Error('d1 is a diode');
    await expect
      .poll(() => resultAt(page, 'devices.d1.id').textContent())
      .toBe(formatValue(d1.id, 'A'));

    await resultAt(page, 'devices.d1.id').click();
    const raise = page.getByRole('dialog', { name: 'Raise a finding on revision A' });
    expect(await raise.getByLabel('Number or input (path)').inputValue()).toBe('devices.d1.id');
    await raise.getByRole('radio', { name: /^Major/ }).check();
    await raise
      .getByLabel('What is wrong')
      .fill('4.3 mA is close to the clamp diode’s rating; add margin.');
    expect(await seriousViolations(page)).toEqual([]);
    await raise.getByRole('button', { name: 'Raise finding' }).click();
    await raise.waitFor({ state: 'detached' });

    const finding = reviewPanel(page).getByRole('article', {
      name: 'Major finding, open, on devices.d1.id',
    });
    await finding.waitFor();
    await page
      .getByRole('button', { name: /raise a finding on devices\.d1\.id.*1 finding: 1 open/ })
      .waitFor();
    await expect
      .poll(() => steps(page).getByRole('button', { name: 'Accept' }).isDisabled())
      .toBe(true);
    await page
      .getByText('1 major finding is still open; close them before accepting or signing off.')
      .waitFor();
    await page.screenshot({ path: join(dir, 'review-checker-finding.png'), fullPage: true });

    await confirmStep(
      page,
      'Return to author',
      /Return revision A to Maren Holt/,
      'D1 runs too hot; see the finding.',
    );
    await page.getByText('Revision A was returned to Maren Holt.').waitFor();
  });

  it('when the author answers and changes R1, then revision B carries the finding with its number marked as changed, and is submitted', async () => {
    const { page } = people.author;
    await fromQueue(page, 'Returned to me');
    const finding = reviewPanel(page).getByRole('article', {
      name: /finding, open, on devices\.d1\.id/,
    });
    await finding.getByLabel('Your answer or reply').fill('R1 raised to 2.2 kΩ: about 1.9 mA now.');
    await finding.getByRole('button', { name: 'Answer' }).click();
    const answered = reviewPanel(page).getByRole('article', {
      name: 'Major finding, answered, on devices.d1.id',
    });
    await answered.getByText('Answered by Maren Holt').waitFor();

    const r1 = page.locator('[data-element="r1"]');
    await r1.getByRole('button', { name: 'Edit R1' }).click();
    const form = page.getByRole('region', { name: 'Edit R1' });
    await form.getByLabel('Resistance (Ω)').fill('2k2');
    await form.getByRole('button', { name: 'Save changes' }).click();
    await page.getByRole('status', { name: 'Save status: Saved' }).waitFor({ timeout: 20_000 });
    await page.getByText(/^Revision B$/).waitFor();
    await answered.getByText('carried from revision A').waitFor();
    await answered.getByText('Number changed').waitFor();

    await expect
      .poll(() => steps(page).getByRole('button', { name: 'Submit for check' }).isEnabled())
      .toBe(true);
    await confirmStep(page, 'Submit for check', /Submit revision B for check/);
    await page.getByText('Revision B was submitted for check.').waitFor();
  });

  it('when the checker closes the finding, then accepting revision B is allowed and done', async () => {
    const { page } = people.checker;
    await fromQueue(page, 'To check');
    const finding = reviewPanel(page).getByRole('article', {
      name: 'Major finding, answered, on devices.d1.id',
    });
    await finding.getByText('Number changed').waitFor();
    await finding.getByLabel('Your comment').fill('Margin is fine now.');
    await finding.getByRole('button', { name: 'Close finding' }).click();
    await reviewPanel(page).getByText('Closed findings (1)').waitFor();

    await expect
      .poll(() => steps(page).getByRole('button', { name: 'Accept' }).isEnabled())
      .toBe(true);
    await confirmStep(page, 'Accept', /Accept revision B/);
    await page.getByText('Revision B was accepted.').waitFor();
  });

  it('when the approver signs with the password, then the signature’s manifestation is on the page', async () => {
    const { page, who } = people.approver;
    await fromQueue(page, 'To sign');
    await steps(page).getByRole('button', { name: 'Sign off…' }).click();
    const dialog = page.getByRole('dialog', { name: 'Sign off revision B' });
    await dialog.getByLabel('Meaning of your signature').selectOption('Approved for release');
    const preview = dialog.getByRole('region', { name: 'Signature preview' });
    expect(await preview.textContent()).toContain('Adaeze Obi');
    expect(await preview.textContent()).toMatch(/Europe\/Berlin \(GMT\+0[12]:00\)/);
    expect(await dialog.textContent()).toContain('licensed engineering practice');
    expect(await seriousViolations(page)).toEqual([]);

    await dialog.getByLabel('Your password').fill('not-the-password');
    await dialog.getByRole('button', { name: 'Sign revision B' }).click();
    await dialog
      .getByText(/password/i)
      .and(dialog.locator('.text-fault'))
      .first()
      .waitFor();
    expect(await dialog.isVisible()).toBe(true);
    await page.screenshot({ path: join(dir, 'review-sign-dialog.png') });

    await dialog.getByLabel('Your password').fill(who.password);
    await dialog.getByRole('button', { name: 'Sign revision B' }).click();
    await dialog.waitFor({ state: 'detached' });
    const signature = page.getByRole('figure', { name: 'Signature of Adaeze Obi' });
    await signature.waitFor();
    const text = (await signature.textContent()) ?? '';
    expect(text).toContain('Signed electronically: Approved for release');
    expect(text).toMatch(/\d{4}-\d\d-\d\d \d\d:\d\d Europe\/Berlin \(GMT\+0[12]:00\)/);
    expect(text).toMatch(/Revision\s*B/);
    expect(text).toMatch(/SHA-256 [0-9a-f]{64}/);
    expect(await seriousViolations(page)).toEqual([]);
    await page.screenshot({ path: join(dir, 'review-signed.png'), fullPage: true });
  });

  it('when the manager opens the audit log, then the chain verifies and the signature is on record with its manifestation', async () => {
    const { page } = people.manager;
    await page.goto(`${baseUrl()}/o/${org.slug}`);
    await page
      .getByRole('navigation', { name: 'Organization' })
      .getByRole('link', { name: 'Audit' })
      .click();
    await page.getByRole('status', { name: /Audit chain: intact, \d+ events/ }).waitFor();
    const filters = page.getByRole('form', { name: 'Filter the audit log' });
    await filters.getByLabel('Action').fill('worksheet.signed');
    await filters.getByRole('button', { name: 'Apply filters' }).click();
    await page.waitForURL(/action=worksheet\.signed/);
    // The unfiltered page stays on screen until the filtered answer arrives (and holds a signed
    // row too), so wait for the table to settle on the header and the one signed event.
    await expect
      .poll(() => page.getByRole('table', { name: 'Audit events' }).getByRole('row').count())
      .toBe(2);
    const row = page
      .getByRole('table', { name: 'Audit events' })
      .getByRole('row', { name: /Signed off/ });
    await row.waitFor();
    const text = (await row.textContent()) ?? '';
    expect(text).toContain(`Signed off "${TITLE}" revision B as "Approved for release"`);
    expect(text).toContain('Adaeze Obi');
    expect(text).toMatch(
      /Signature: Adaeze Obi · Approved for release · .* · SHA-256 [0-9a-f]{64}/,
    );
    const csv = page.getByRole('link', { name: 'Export these events as CSV' });
    expect(await csv.getAttribute('href')).toBe(
      `/api/orgs/${org.id}/audit/export.csv?action=worksheet.signed`,
    );
    expect(await seriousViolations(page)).toEqual([]);
    await page.screenshot({ path: join(dir, 'review-audit.png'), fullPage: true });

    await page.goto(`${worksheetUrl}/history`);
    await page
      .getByRole('article', { name: 'Revision B' })
      .getByRole('figure', { name: 'Signature of Adaeze Obi' })
      .waitFor();
    await page
      .getByRole('table', { name: /Inputs changed/ })
      .getByRole('row', { name: /r1/i })
      .first()
      .waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await page.screenshot({ path: join(dir, 'review-history.png'), fullPage: true });
    expect(pageErrors).toEqual([]);
  });
});

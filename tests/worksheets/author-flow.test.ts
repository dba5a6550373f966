import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import {
  circuitSchema,
  formatValue,
  parseDeck,
  solveOperatingPoint,
  type CircuitInput,
} from '@biasproof/calc';
import { seriousViolations } from '../support/axe.ts';
import { openBrowser, type BrowserSession } from '../support/browser.ts';
import {
  addMembership,
  createOrganization,
  createPerson,
  uniqueSuffix,
  type FixtureOrg,
  type FixturePerson,
} from '../support/fixtures.ts';
import {
  addPart,
  circuitPanel,
  resultAt,
  resultsPanel,
  screenshotDir,
  signIn,
} from '../support/worksheet-editor.ts';

const badDeck = `Clamp with a typo
V1 in 0 DC 9
R1 in out 2k2
R2 out 0 4x7
D1 out 0 DFAST
.model DFAST D (IS=2n N=1.9)
.end
`;

const goodDeck = `Two-diode clamp
* supply and feed
V1 in 0 DC 9
R1 in out 2k2
D1 out mid DFAST
D2 mid 0 DFAST
.model DFAST D (IS=2n N=1.9 RS=0.5)
.op
.end
`;

/** The diode and resistor the author builds through the forms. */
const built: CircuitInput = {
  elements: [
    { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 5 },
    { kind: 'R', name: 'R1', nodes: ['in', 'out'], value: 1000 },
    { kind: 'D', name: 'D1', nodes: ['out', '0'], model: 'DSIG' },
  ],
  models: [{ name: 'DSIG', kind: 'D', params: { IS: 1e-14, N: 1 } }],
};

const views = [
  ['Bias point', 'bias'],
  ['Small-signal', 'small-signal'],
  ['Signal size', 'signal-size'],
  ['Load line', 'load-line'],
] as const;

// Issue 5's browser test: an author's whole job on one worksheet, against the real server.
describe('an author builds, checks and saves a worksheet in the browser', () => {
  const run = uniqueSuffix();
  let org: FixtureOrg;
  let author: FixturePerson;
  let browser: BrowserSession;
  let page: Page;
  let worksheetUrl: string;

  beforeAll(async () => {
    org = await createOrganization(`Ferrite Bench ${run}`);
    author = await createPerson('Maren Holt', `ferrite-${run}.example`);
    await addMembership(org, author, ['author']);
    browser = await openBrowser();
    page = await browser.context.newPage();
    await page.setViewportSize({ width: 1600, height: 1000 });
  });

  afterAll(() => browser?.close());

  async function saved() {
    await page.getByRole('status', { name: 'Save status: Saved' }).waitFor({ timeout: 20_000 });
  }

  it('when the author signs in, then they create a project and an empty worksheet that opens', async () => {
    await signIn(page, author.email, author.password, org.slug);
    await page
      .getByRole('navigation', { name: 'Organization' })
      .getByRole('link', { name: 'Projects' })
      .click();
    await page.getByText('No active projects yet.').waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    const form = page.getByRole('form', { name: 'New project' });
    await form.getByLabel('Project name').fill('Sensor front end');
    await form.getByLabel('Code').fill('sfe-1');
    await form.getByRole('button', { name: 'Create project' }).click();
    await page.getByRole('row', { name: /Sensor front end/ }).waitFor();
    expect(await page.getByRole('row', { name: /Sensor front end/ }).textContent()).toContain(
      'SFE-1',
    );

    await page
      .getByRole('navigation', { name: 'Organization' })
      .getByRole('link', { name: 'Worksheets' })
      .click();
    await page.getByText('No worksheets yet.').waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByRole('button', { name: 'New worksheet' }).click();
    const create = page.getByRole('form', { name: 'New worksheet' });
    await create.getByLabel('Project').selectOption({ label: 'SFE-1 · Sensor front end' });
    await create.getByLabel('Title').fill('Diode bias, channel A');
    await create.getByRole('button', { name: 'Create and open' }).click();
    await page.getByRole('heading', { level: 1, name: 'Diode bias, channel A' }).waitFor();
    worksheetUrl = page.url();
    expect(worksheetUrl).toMatch(new RegExp(`/o/${org.slug}/worksheets/[0-9a-f-]{36}$`));
    await resultsPanel(page).getByText('Nothing to solve yet.').waitFor();
    await resultsPanel(page).getByText('Stored results').waitFor();
  });

  it('when the author builds a diode and resistor through the forms, then the bias numbers are the engine’s', async () => {
    await addPart(page, 'Voltage source (V)', {
      '+ node': 'in',
      '− node': '0',
      'DC voltage (V)': '5',
    });
    await addPart(page, 'Resistor (R)', {
      'First node': 'in',
      'Second node': 'out',
      'Resistance (Ω)': '1k',
    });
    await addPart(page, 'Diode (D)', { 'Anode node': 'out', 'Cathode node': '0' }, async (form) => {
      await form.getByRole('button', { name: 'New model' }).click();
      const model = form.getByRole('group', { name: /New model/ });
      await model.getByLabel('Model name').fill('DSIG');
      await model.getByLabel('Parameter 1 value').fill('1e-14');
      await model.getByLabel('Parameter 2 value').fill('1');
      await model.getByRole('button', { name: 'Add model' }).click();
      await expect.poll(() => form.getByLabel('Model').inputValue()).toBe('DSIG');
    });
    const settings = page.getByRole('region', { name: 'Analysis settings' });
    await settings.getByLabel('Input source').selectOption('V1');
    await settings.getByLabel('Output node').selectOption('out');

    const engine = solveOperatingPoint(built);
    const d1 = engine.devices.d1;
    if (d1?.kind !== 'D') throw new Error('d1 is a diode');
    await expect
      .poll(() => resultAt(page, 'nodes.out').textContent())
      .toBe(formatValue(engine.nodes.out!, 'V'));
    await expect
      .poll(() => resultAt(page, 'devices.d1.id').textContent())
      .toBe(formatValue(d1.id, 'A'));
    expect(await resultAt(page, 'devices.d1.region').textContent()).toBe('forward');

    await saved();
    await resultsPanel(page).getByText('Stored results').waitFor();
    expect(await seriousViolations(page)).toEqual([]);
  });

  it('when the author switches the diode law, then the bias follows and the comparison shows it in use', async () => {
    await page.getByRole('radio', { name: 'Constant drop' }).check();
    await expect.poll(() => resultAt(page, 'nodes.out').textContent()).toBe(formatValue(0.7, 'V'));
    const comparison = page.getByRole('table', { name: 'Diode-law comparison' });
    await comparison.getByRole('columnheader', { name: 'Constant drop (in use)' }).waitFor();
    expect(await comparison.getByRole('columnheader', { name: /Exponential/ }).count()).toBe(1);
    await page.getByRole('radio', { name: 'Exponential (Shockley)' }).check();
    await comparison
      .getByRole('columnheader', { name: 'Exponential (Shockley) (in use)' })
      .waitFor();
  });

  it('when the author imports a deck with an error, then its line is named; a good deck replaces the circuit and exports back the same', async () => {
    const deckInput = page.getByLabel('Import a SPICE deck (.cir, .sp, .net)');
    await deckInput.setInputFiles({
      name: 'clamp.cir',
      mimeType: 'text/plain',
      buffer: Buffer.from(badDeck),
    });
    const problem = page.getByRole('alert').filter({ hasText: 'clamp.cir was not imported' });
    await problem.waitFor();
    expect(await problem.textContent()).toContain('Line 4:');
    expect(await circuitPanel(page).getByRole('row', { name: /^R2\b/ }).count()).toBe(0);

    await deckInput.setInputFiles({
      name: 'clamp-fixed.cir',
      mimeType: 'text/plain',
      buffer: Buffer.from(goodDeck),
    });
    await page.getByText('Imported clamp-fixed.cir: 4 elements.').waitFor();
    const engine = solveOperatingPoint(parseDeck(goodDeck).circuit);
    await expect
      .poll(() => resultAt(page, 'nodes.mid').textContent())
      .toBe(formatValue(engine.nodes.mid!, 'V'));

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Export deck' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe('two-diode-clamp.cir');
    const exported = await readFile(await download.path(), 'utf8');
    expect(circuitSchema.parse(parseDeck(exported).circuit)).toEqual(
      circuitSchema.parse(parseDeck(goodDeck).circuit),
    );
  });

  it('when autosave has run and the page reloads, then the stored results are the engine’s', async () => {
    await saved();
    await page.reload();
    await page.getByRole('heading', { level: 1, name: 'Diode bias, channel A' }).waitFor();
    await resultsPanel(page).getByText('Stored results').waitFor();
    const engine = solveOperatingPoint(parseDeck(goodDeck).circuit);
    await expect
      .poll(() => resultAt(page, 'nodes.out').textContent())
      .toBe(formatValue(engine.nodes.out!, 'V'));
    expect(await circuitPanel(page).getByRole('row', { name: /^D2\b/ }).count()).toBe(1);
    expect(await resultsPanel(page).getByTestId('stored-from').textContent()).toMatch(
      /Revision A · engine \S+ · hash [0-9a-f]{12}/,
    );
  });

  it('when the author opens each results view, then it is screenshotted and passes the accessibility scan', async () => {
    const dir = screenshotDir();
    for (const [tab, file] of views) {
      await resultsPanel(page).getByRole('tab', { name: tab }).click();
      await resultsPanel(page).getByRole('tabpanel').waitFor();
      if (file === 'load-line' || file === 'small-signal') {
        await resultsPanel(page).locator('svg.recharts-surface').first().waitFor();
      }
      await resultsPanel(page).screenshot({ path: join(dir, `worksheet-${file}.png`) });
      expect(await seriousViolations(page), tab).toEqual([]);
    }
    await page.screenshot({ path: join(dir, 'worksheet-page.png'), fullPage: true });
    expect(page.url()).toBe(worksheetUrl);

    const nav = page.getByRole('navigation', { name: 'Organization' });
    await nav.getByRole('link', { name: 'Worksheets' }).click();
    const row = page.getByRole('row', { name: /Diode bias, channel A/ });
    await row.waitFor();
    expect(await row.textContent()).toContain('Draft');
    await page.screenshot({ path: join(dir, 'worksheets-list.png'), fullPage: true });
    await nav.getByRole('link', { name: 'Projects' }).click();
    await page.getByRole('row', { name: /Sensor front end/ }).waitFor();
    await page.screenshot({ path: join(dir, 'projects.png'), fullPage: true });
  });
});

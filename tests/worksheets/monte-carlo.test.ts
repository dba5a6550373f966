import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import {
  analysisSettingsSchema,
  formatValue,
  parseDeck,
  runMonteCarlo,
  type LimitInput,
  type VariedParameterInput,
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
import { resultAt, resultsPanel, screenshotDir, signIn } from '../support/worksheet-editor.ts';

/** A common-emitter stage biased by a divider: the Monte Carlo benchmark circuit. */
const deck = `Common-emitter stage
VCC vcc 0 DC 12
R1 vcc b 47k
R2 b 0 10k
RC vcc c 4.7k
RE e 0 1k
Q1 c b e QN
.model QN NPN (IS=1e-14 BF=150)
.end
`;

const varied: VariedParameterInput[] = [
  { target: 'R1', tolerancePercent: 1 },
  { target: 'R2', tolerancePercent: 1 },
  { target: 'RC', tolerancePercent: 1 },
  { target: 'RE', tolerancePercent: 1 },
  { target: 'QN.BF', tolerancePercent: 30 },
];
const limit: LimitInput = { path: 'nodes.c', min: 5.4, max: 5.9, unit: 'V' };

/** The aria-valuenow of the progress bar each time it changes, recorded in the page. */
async function recordProgress(page: Page) {
  await page.evaluate(() => {
    const seen: number[] = [];
    (window as unknown as { progressSeen: number[] }).progressSeen = seen;
    new MutationObserver(() => {
      const bar = document.querySelector('[role="progressbar"]');
      const now = Number(bar?.getAttribute('aria-valuenow'));
      if (bar && seen.at(-1) !== now) seen.push(now);
    }).observe(document.body, { subtree: true, childList: true, attributes: true });
  });
  return () => page.evaluate(() => (window as unknown as { progressSeen: number[] }).progressSeen);
}

// Issue 6's browser test: Monte Carlo from the variation view, with progress, cancel and yield.
describe('an author runs a Monte Carlo of a worksheet in the browser', () => {
  const run = uniqueSuffix();
  let org: FixtureOrg;
  let author: FixturePerson;
  let browser: BrowserSession;
  let page: Page;
  let view: Locator;

  beforeAll(async () => {
    org = await createOrganization(`Tolerance Bench ${run}`);
    author = await createPerson('Ilse Varga', `tolerance-${run}.example`);
    await addMembership(org, author, ['author']);
    browser = await openBrowser();
    page = await browser.context.newPage();
    await page.setViewportSize({ width: 1600, height: 1100 });
    view = resultsPanel(page).getByRole('tabpanel');
  });

  afterAll(() => browser?.close());

  async function saved() {
    await page.getByRole('status', { name: 'Save status: Saved' }).waitFor({ timeout: 20_000 });
  }

  it('when the author sets tolerances and a limit, then the variation view is ready to run', async () => {
    await signIn(page, author.email, author.password, org.slug);
    const nav = page.getByRole('navigation', { name: 'Organization' });
    await nav.getByRole('link', { name: 'Projects' }).click();
    const project = page.getByRole('form', { name: 'New project' });
    await project.getByLabel('Project name').fill('Preamp');
    await project.getByLabel('Code').fill('amp-1');
    await project.getByRole('button', { name: 'Create project' }).click();
    await page.getByRole('row', { name: /Preamp/ }).waitFor();
    await nav.getByRole('link', { name: 'Worksheets' }).click();
    await page.getByRole('button', { name: 'New worksheet' }).click();
    const create = page.getByRole('form', { name: 'New worksheet' });
    await create.getByLabel('Project').selectOption({ label: 'AMP-1 · Preamp' });
    await create.getByLabel('Title').fill('CE stage bias spread');
    await create.getByRole('button', { name: 'Create and open' }).click();
    await page.getByRole('heading', { level: 1, name: 'CE stage bias spread' }).waitFor();
    await page.getByLabel('Import a SPICE deck (.cir, .sp, .net)').setInputFiles({
      name: 'ce-stage.cir',
      mimeType: 'text/plain',
      buffer: Buffer.from(deck),
    });
    await page.getByText('Imported ce-stage.cir: 6 elements.').waitFor();

    await resultsPanel(page).getByRole('tab', { name: 'Variation' }).click();
    const setup = view.getByRole('form', { name: 'Variation setup' });
    for (const [i, p] of varied.entries()) {
      await setup.getByRole('button', { name: 'Add varied parameter' }).click();
      await setup.getByLabel(`What varies, row ${i + 1}`).selectOption(p.target);
      await setup.getByLabel(`Tolerance (%) of ${p.target}`).fill(String(p.tolerancePercent));
    }

    await resultsPanel(page).getByRole('tab', { name: 'Limits and checks' }).click();
    await view.getByRole('button', { name: 'Add limit' }).click();
    const form = view.getByRole('region', { name: 'New limit' });
    await form.getByLabel('Result path').fill(limit.path);
    await form.getByLabel('Min').fill(String(limit.min));
    await form.getByLabel('Max').fill(String(limit.max));
    await form.getByRole('button', { name: 'Add limit' }).click();
    await expect
      .poll(() => resultAt(page, 'variation.limits.nodes.c.nominal').textContent())
      .toMatch(/^✓ Pass margin/);
    await saved();
  });

  it('when the author starts a long run and cancels it, then the progress bar moved and nothing was recorded', async () => {
    await resultsPanel(page).getByRole('tab', { name: 'Variation' }).click();
    const mc = view.getByRole('form', { name: 'Monte Carlo run' });
    await mc.getByLabel('Samples').fill('100000');
    await mc.getByLabel('Seed').fill('bench-42');
    const progress = await recordProgress(page);
    await mc.getByRole('button', { name: 'Run Monte Carlo' }).click();
    const bar = view.getByRole('progressbar', { name: 'Monte Carlo progress' });
    await expect
      .poll(async () => Number(await bar.getAttribute('aria-valuenow')))
      .toBeGreaterThan(0);
    const first = Number(await bar.getAttribute('aria-valuenow'));
    await expect
      .poll(async () => Number(await bar.getAttribute('aria-valuenow')))
      .toBeGreaterThan(first);
    await mc.getByRole('button', { name: 'Cancel' }).click();

    const status = view.getByText(/^Cancelled after \d+ of 100000 samples/);
    await status.waitFor();
    const done = Number(/after (\d+)/.exec((await status.textContent()) ?? '')?.[1]);
    expect(done).toBeGreaterThan(first);
    expect(done).toBeLessThan(100_000);
    const seen = await progress();
    expect(seen).toEqual([...seen].sort((a, b) => a - b));
    expect(await view.getByRole('progressbar').count()).toBe(0);
    expect(await view.getByTestId('monte-carlo-result').count()).toBe(0);
    // A cancelled run changes nothing in the draft, so there is nothing to save.
    expect(await page.getByRole('status', { name: 'Save status: Saved' }).count()).toBe(1);
  });

  it('when the author runs 2000 samples, then the bar climbs to the end and the histogram and yield are the engine’s', async () => {
    const mc = view.getByRole('form', { name: 'Monte Carlo run' });
    await mc.getByLabel('Samples').fill('2000');
    const progress = await recordProgress(page);
    await mc.getByRole('button', { name: 'Run Monte Carlo' }).click();
    await view
      .getByRole('img', { name: /^Histogram of nodes\.c: 2000 samples/ })
      .waitFor({ timeout: 60_000 });
    const seen = await progress();
    expect(seen.length).toBeGreaterThan(3);
    expect(seen).toEqual([...seen].sort((a, b) => a - b));
    expect(seen[0]).toBeLessThan(2000);

    // Same seed, same samples: the engine's own run in this process is the reference.
    const engine = runMonteCarlo({
      circuit: parseDeck(deck).circuit,
      settings: analysisSettingsSchema.parse({}),
      parameters: varied,
      probes: [limit.path],
      samples: 2000,
      seed: 'bench-42',
      limits: [limit],
    });
    const expected = formatValue(engine.yield!.fraction * 100, '%');
    expect(await resultAt(page, 'variation.monteCarlo.yield').textContent()).toBe(expected);
    expect(engine.yield!.fraction).toBeGreaterThan(0);
    expect(engine.yield!.fraction).toBeLessThan(1);
    expect(await resultAt(page, 'variation.monteCarlo.nodes.c.mean').textContent()).toBe(
      formatValue(engine.probes[limit.path]!.statistics.mean, 'V'),
    );
    expect(await seriousViolations(page)).toEqual([]);
    const dir = screenshotDir();
    await resultsPanel(page).screenshot({ path: join(dir, 'worksheet-variation.png') });

    await resultsPanel(page).getByRole('tab', { name: 'Limits and checks' }).click();
    expect(await resultAt(page, 'variation.limits.nodes.c.yield').textContent()).toBe(
      formatValue(engine.yield!.limits[0]!.fraction * 100, '%'),
    );
    expect(await seriousViolations(page)).toEqual([]);
    await resultsPanel(page).screenshot({ path: join(dir, 'worksheet-limits.png') });
  });

  it('when the page reloads, then the stored results hold the run with its seed', async () => {
    await saved();
    await page.reload();
    await page.getByRole('heading', { level: 1, name: 'CE stage bias spread' }).waitFor();
    await resultsPanel(page).getByText('Stored results').waitFor();
    await resultsPanel(page).getByRole('tab', { name: 'Variation' }).click();
    await view.getByText(/From the worksheet’s results/).waitFor();
    expect(await resultAt(page, 'variation.monteCarlo.seed').textContent()).toBe('bench-42');
    expect(await resultAt(page, 'variation.monteCarlo.samples').textContent()).toBe('2000');
    await view.getByRole('img', { name: /^Histogram of nodes\.c: 2000 samples/ }).waitFor();
  });
});

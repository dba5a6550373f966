import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { formatValue } from '@biasproof/calc';
import {
  listResponseSchema,
  meResponseSchema,
  worksheetListItemSchema,
  editableWorksheetStates,
  worksheetSchema,
  type WorksheetListItem,
} from '@biasproof/shared';
import { loadConfig } from '../../apps/server/src/config.ts';
import { createSequelize } from '../../apps/server/src/db/connection.ts';
import { demoSteps } from '../../seed/src/demo-steps.ts';
import { DEMO_PASSWORD } from '../../seed/src/demo-organizations.ts';
import { DEMO_ORG_SLUG, demoProjects } from '../../seed/src/demo-worksheets.ts';
import { baseUrl, openBrowser, type BrowserSession } from '../support/browser.ts';
import { circuitPanel, resultsPanel } from '../support/worksheet-editor.ts';

const views = ['Bias point', 'Small-signal', 'Signal size', 'Load line'] as const;

/** One shown result: its path, its text and its exact value (the title holds the raw number). */
interface Shown {
  path: string;
  text: string;
  title: string | null;
}

/** Every `[data-result-path]` of every results view, in page order. */
async function shownResults(page: Page): Promise<Shown[]> {
  const all: Shown[] = [];
  const panel = resultsPanel(page);
  for (const view of views) {
    await panel.getByRole('tab', { name: view }).click();
    await panel.getByRole('tabpanel').waitFor();
    const cells = await panel.locator('[data-result-path]').evaluateAll((nodes) =>
      nodes.map((n) => ({
        path: n.getAttribute('data-result-path') ?? '',
        text: (n.textContent ?? '').trim(),
        title: n.getAttribute('title'),
      })),
    );
    all.push(...cells.map((c) => ({ ...c, path: `${view}: ${c.path}` })));
  }
  await panel.getByRole('tab', { name: views[0] }).click();
  return all;
}

/** Cells sorted by path, then text, so two pages' cells pair up whatever their row order. */
function byPath(cells: Shown[]): Shown[] {
  const key = (c: Shown) => `${c.path}\u0000${c.text}`;
  return [...cells].sort((a, b) => (key(a) < key(b) ? -1 : key(a) > key(b) ? 1 : 0));
}

/** The number in a result's title (`"0.65 V"` → 0.65); null when there is none. */
function rawValue(title: string | null): number | null {
  const value = title === null ? NaN : Number(title.split(' ')[0]);
  return Number.isFinite(value) ? value : null;
}

async function signIn(page: Page, email: string) {
  await page.goto(`${baseUrl()}/sign-in`);
  await page.getByRole('textbox', { name: 'E-mail' }).fill(email);
  await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

async function api<T>(page: Page, path: string, schema: { parse(v: unknown): T }): Promise<T> {
  const response = await page.request.get(`${baseUrl()}/api${path}`);
  expect(response.status(), path).toBe(200);
  return schema.parse(await response.json());
}

const authors = [...new Set(demoProjects.flatMap((p) => p.worksheets.map((w) => w.author)))];

// Issue 5: "the server's stored results equal the browser preview for every demo worksheet".
describe('the demo worksheets show the same numbers stored and previewed', () => {
  let browser: BrowserSession;

  beforeAll(async () => {
    // The run's database is fresh: load the demo scenario into it, as `npm start` does.
    const config = loadConfig();
    const sequelize = createSequelize(config.databaseUrl);
    try {
      for (const step of demoSteps) await step.load(sequelize, config);
    } finally {
      await sequelize.close();
    }
    browser = await openBrowser();
  });

  afterAll(() => browser?.close());

  it('the server’s stored results equal the browser preview for every editable demo worksheet, and every demo worksheet shows its stored numbers to the bit', async () => {
    let checked = 0;
    let previewed = 0;
    for (const author of authors) {
      const page = await browser.context.newPage();
      await page.setViewportSize({ width: 1600, height: 1000 });
      await signIn(page, author);
      const me = await api(page, '/auth/me', meResponseSchema);
      const org = me.memberships.find((m) => m.orgSlug === DEMO_ORG_SLUG);
      if (!org) throw new Error(`${author} is not a member of ${DEMO_ORG_SLUG}`);
      const list = await api(
        page,
        `/orgs/${org.orgId}/worksheets?authorId=${me.user.id}&limit=100`,
        listResponseSchema(worksheetListItemSchema),
      );
      const mine = demoProjects.flatMap((p) => p.worksheets).filter((w) => w.author === author);
      expect(list.items.map((w) => w.title).sort()).toEqual(mine.map((w) => w.title).sort());
      for (const item of list.items) {
        if ((await checkWorksheet(page, org.orgId, item)) === 'previewed') previewed += 1;
        checked += 1;
      }
      await page.close();
    }
    expect(checked).toBe(demoProjects.flatMap((p) => p.worksheets).length);
    // Frozen revisions (in check, checked, signed off, withdrawn) cannot be edited, so only their
    // stored numbers are compared; the drafts and the returned worksheet (four of the eight
    // circuits, diodes, BJTs and MOSFETs among them) are previewed in this browser as well.
    expect(previewed).toBeGreaterThanOrEqual(4);
  });
});

async function checkWorksheet(
  page: Page,
  orgId: string,
  item: WorksheetListItem,
): Promise<'previewed' | 'stored-only'> {
  const worksheet = await api(page, `/orgs/${orgId}/worksheets/${item.id}`, worksheetSchema);
  const stored = worksheet.currentRevision.results;
  expect(stored.status, item.title).toBe('solved');
  if (stored.status !== 'solved') return 'stored-only';

  await page.goto(`${baseUrl()}/o/${DEMO_ORG_SLUG}/worksheets/${item.id}`);
  await page.getByRole('heading', { level: 1, name: item.title }).waitFor();
  const panel = resultsPanel(page);
  await panel.getByText('Stored results', { exact: true }).waitFor();
  const fromStore = await shownResults(page);
  expect(fromStore.length, item.title).toBeGreaterThan(10);

  // A few key numbers against the API's stored results, to the last bit (the title attribute
  // holds the raw value, the text the formatted one).
  const nodes = Object.entries(stored.bias.nodes);
  expect(nodes.length, item.title).toBeGreaterThan(0);
  for (const [node, volts] of nodes) {
    const cell = fromStore.find((c) => c.path === `Bias point: nodes.${node}`);
    expect(cell, `${item.title} nodes.${node}`).toEqual({
      path: `Bias point: nodes.${node}`,
      text: formatValue(volts, 'V'),
      title: `${volts} V`,
    });
  }
  const supply = fromStore.find((c) => c.path === 'Bias point: supplyPower');
  expect(supply?.title, `${item.title} supplyPower`).toBe(`${stored.bias.supplyPower} W`);
  if (!editableWorksheetStates.includes(item.state)) return 'stored-only';

  // The same draft as a local preview: open the first part's form, type a character into its
  // first field and take it back. The form then previews an unchanged element, so the page
  // computes the whole draft in this browser and says "Local preview".
  const first = worksheet.currentRevision.circuit.elements[0]!;
  await circuitPanel(page)
    .getByRole('button', { name: `Edit ${first.name}` })
    .click();
  const form = circuitPanel(page).getByRole('region', { name: `Edit ${first.name}` });
  await form.waitFor();
  await page.keyboard.press('End');
  await page.keyboard.type('x');
  await page.keyboard.press('Backspace');
  await panel.getByText('Local preview', { exact: true }).waitFor();
  await panel.getByText(`Includes unsaved changes to ${first.name}.`).waitFor();
  await panel
    .getByRole('status')
    .getByText(/^Engine time/)
    .waitFor();
  // The solver's final residual is round-off itself (its last bits differ between engines that
  // round exp/pow differently), so it is left out; every other shown result is compared.
  const compared = (cells: Shown[]) => byPath(cells.filter((c) => !c.path.endsWith(': residual')));
  const preview = compared(await shownResults(page));
  const storedCells = compared(fromStore);
  // Every shown number is the same text (rows may come in another order: the stored results'
  // objects were decoded from JSON). The raw values behind them (title attributes) agree to
  // about an ulp, not to the bit: Node's V8 and Chromium's V8 round some exp/pow results
  // differently in the last bit.
  expect(
    preview.map(({ path, text }) => `${path} = ${text}`),
    item.title,
  ).toEqual(storedCells.map(({ path, text }) => `${path} = ${text}`));
  preview.forEach((cell, i) => {
    const raw = rawValue(cell.title);
    const storedRaw = rawValue(storedCells[i]!.title);
    if (raw === null || storedRaw === null) {
      expect(cell.title, `${item.title} ${cell.path}`).toBe(storedCells[i]!.title);
      return;
    }
    const scale = Math.max(Math.abs(storedRaw), Number.MIN_VALUE);
    // Percent differences of two nearly equal numbers magnify a last-bit difference.
    const limit = /Percent$/.test(cell.path) ? 1e-3 : 1e-9;
    expect(Math.abs(raw - storedRaw) / scale, `${item.title} ${cell.path}`).toBeLessThan(limit);
  });

  await form.getByRole('button', { name: 'Cancel' }).click();
  await form.waitFor({ state: 'detached' });
  await panel.getByText('Stored results', { exact: true }).waitFor();
  return 'previewed';
}

import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Locator, Page } from 'playwright-core';
import { baseUrl } from './browser.ts';

/** Walks the worksheet editor's forms the way an author does (by label and role). */

/** Signs in through the sign-in page and waits for the organization's home. */
export async function signIn(page: Page, email: string, password: string, orgSlug: string) {
  await page.goto(`${baseUrl()}/sign-in`);
  await page.getByRole('textbox', { name: 'E-mail' }).fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(`${baseUrl()}/o/${orgSlug}`);
}

export function circuitPanel(page: Page): Locator {
  return page.getByRole('region', { name: 'Circuit' });
}

export function resultsPanel(page: Page): Locator {
  return page.getByRole('region', { name: 'Results' });
}

/** The text shown for a result path, e.g. `nodes.out`. */
export function resultAt(page: Page, path: string): Locator {
  return page.locator(`[data-result-path="${path}"]`).first();
}

/** Adds a part through its typed form: kind as the select names it, fields by label. */
export async function addPart(
  page: Page,
  kindOption: string,
  fields: Record<string, string>,
  beforeSubmit?: (form: Locator) => Promise<void>,
) {
  const panel = circuitPanel(page);
  await panel.getByLabel('Kind of part').selectOption({ label: kindOption });
  await panel.getByRole('button', { name: 'Add part' }).click();
  const form = panel.getByRole('region', { name: /^New / });
  for (const [label, value] of Object.entries(fields)) {
    await form.getByLabel(label, { exact: true }).fill(value);
  }
  await beforeSubmit?.(form);
  await form.getByRole('button', { name: 'Add to circuit' }).click();
  await form.waitFor({ state: 'detached' });
}

/** Where the test run keeps its screenshots (gitignored). */
export function screenshotDir(): string {
  const dir = join(import.meta.dirname, '..', '..', '.data', 'screenshots');
  mkdirSync(dir, { recursive: true });
  return dir;
}

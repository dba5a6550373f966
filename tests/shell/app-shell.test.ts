import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AxeBuilder } from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { baseUrl, openBrowser, type BrowserSession } from '../support/browser.ts';

describe('the app shell in a real browser', () => {
  let browser: BrowserSession;
  let page: Page;
  beforeAll(async () => {
    browser = await openBrowser();
    page = await browser.context.newPage();
    await page.goto(baseUrl());
  });
  afterAll(() => browser.close());

  it('when opened, then the header names the product and the health status says the database is ok', async () => {
    await expect.poll(() => page.getByRole('banner').textContent()).toContain('Biasproof');
    await page.getByText('Database ok').waitFor({ timeout: 15_000 });
  });

  it('when rendered, then the body font is Noto Sans, served by the app itself', async () => {
    const family = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
    expect(family).toMatch(/^["']?Noto Sans["']?/);
    const loaded = await page.evaluate(async () => {
      await document.fonts.ready;
      return [...document.fonts].filter(
        (f) => f.family.replace(/["']/g, '') === 'Noto Sans' && f.status === 'loaded',
      ).length;
    });
    expect(loaded).toBeGreaterThan(0);
    const fontRequests = await page.evaluate(() =>
      performance
        .getEntriesByType('resource')
        .map((e) => e.name)
        .filter((n) => /\.woff2?($|\?)/.test(n)),
    );
    expect(fontRequests.length).toBeGreaterThan(0);
    for (const url of fontRequests) expect(new URL(url).origin).toBe(new URL(baseUrl()).origin);
  });

  it('when scanned with axe, then there is no serious or critical violation', async () => {
    const results = await new AxeBuilder({ page }).analyze();
    const bad = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
    expect(bad.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
  });

  it('when a deep link is opened, then the server answers with the app and its sign-in page', async () => {
    const res = await page.goto(`${baseUrl()}/sign-in`);
    expect(res?.status()).toBe(200);
    await expect
      .poll(() => page.getByRole('heading', { level: 1 }).textContent())
      .toMatch(/sign in/i);
  });
});

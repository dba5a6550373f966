// Measures issue 5's worksheet goals in Chromium against a running Biasproof with the demo data
// (`npm start`): (a) preview recompute after a keystroke, per demo worksheet; (b) navigation to
// an interactive worksheet page, median of 5 loads; (c) gzip size of the JS the first page
// (/sign-in) loads. Prints figures and the machine; asserts nothing.
//
//   BASE_URL=http://localhost:3000 npm run measure -w @biasproof/tests
/* global document, window, MutationObserver -- in page.evaluate / waitForFunction callbacks */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { cpus, tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { chromium } from 'playwright-core';

const baseUrl = (process.env.BASE_URL ?? 'http://localhost:3000').replace(/\/$/, '');
const webDist = join(import.meta.dirname, '..', '..', 'apps', 'web', 'dist');
const DEMO_ORG_SLUG = 'quietline-analog';
const DEMO_PASSWORD = 'quiescent-demo-2026';
const AUTHORS = ['tomas.lindqvist@quietline.example', 'priya.raman@quietline.example'];
const KEYSTROKES = 40;
const WARM_UP = 4;
const LOADS = 5;

const median = (xs) => quantile(xs, 0.5);
function quantile(xs, q) {
  const s = [...xs].sort((a, b) => a - b);
  if (!s.length) return NaN;
  const i = (s.length - 1) * q;
  const lo = Math.floor(i);
  return s[lo] + (s[Math.ceil(i)] - s[lo]) * (i - lo);
}
const ms = (x) => (Number.isFinite(x) ? `${x.toFixed(1)} ms` : '—');

async function openBrowser() {
  const profile = mkdtempSync(join(tmpdir(), 'biasproof-measure-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1600, height: 1000 },
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
  return {
    context,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

async function signIn(page, email) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByRole('textbox', { name: 'E-mail' }).fill(email);
  await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

async function api(page, path) {
  const response = await page.request.get(`${baseUrl}/api${path}`);
  if (!response.ok()) throw new Error(`GET ${path}: ${response.status()}`);
  return response.json();
}

/** (c) Every same-origin script /sign-in loads, gzipped from apps/web/dist with zlib. */
async function initialJs(context) {
  const page = await context.newPage();
  const scripts = new Set();
  page.on('response', (response) => {
    const url = new URL(response.url());
    if (url.origin === baseUrl && response.request().resourceType() === 'script') {
      scripts.add(url.pathname);
    }
  });
  await page.goto(`${baseUrl}/sign-in`, { waitUntil: 'networkidle' });
  await page.close();
  const files = [...scripts].map((path) => {
    const bytes = readFileSync(join(webDist, path));
    return { path, raw: bytes.length, gzip: gzipSync(bytes).length };
  });
  return files.sort((a, b) => b.gzip - a.gzip);
}

/**
 * (a) In the first voltage source's edit form, types a digit at the end of its DC value and takes
 * it back, again and again: each keystroke is a valid element, so the page previews the whole
 * draft. A capture-phase keydown listener stamps the keystroke; a MutationObserver on the
 * results' status line stamps the moment the new numbers are in the DOM ("Engine time …" after
 * "Updating…"). Both the page's own engine time (the worker's compute) and keystroke → numbers
 * shown (20 ms debounce + worker round trip + React render) are reported.
 */
async function keystrokes(page, worksheet) {
  const source = worksheet.currentRevision.circuit.elements.find((e) => e.kind === 'V');
  if (!source) return null;
  await page.getByRole('button', { name: `Edit ${source.name}` }).click();
  const form = page.getByRole('region', { name: `Edit ${source.name}` });
  const field = form.getByLabel('DC voltage (V)', { exact: true });
  await field.click();
  await field.press('End');
  await page.evaluate(() => {
    const status = document.querySelector('[aria-labelledby="ws-results"] [role="status"]');
    const w = /** @type {any} */ (window);
    w.__samples = [];
    w.__pending = null;
    document.addEventListener(
      'keydown',
      () => {
        w.__pending = { t0: performance.now(), sawUpdating: false };
      },
      { capture: true },
    );
    new MutationObserver(() => {
      const p = w.__pending;
      if (!p) return;
      const text = status?.textContent ?? '';
      if (text.startsWith('Updating')) p.sawUpdating = true;
      const engine = /^Engine time ([\d.]+) ms/.exec(text);
      if (engine && p.sawUpdating) {
        w.__samples.push({ shownMs: performance.now() - p.t0, engineMs: Number(engine[1]) });
        w.__pending = null;
      }
    }).observe(status, { childList: true, characterData: true, subtree: true });
  });
  for (let i = 0; i < KEYSTROKES + WARM_UP; i += 1) {
    await page.keyboard.press(i % 2 === 0 ? '1' : 'Backspace');
    await page.waitForFunction((n) => window.__samples.length >= n, i + 1, { timeout: 10_000 });
    await page.waitForTimeout(30);
  }
  const samples = (await page.evaluate(() => window.__samples)).slice(WARM_UP);
  await form.getByRole('button', { name: 'Cancel' }).click();
  return {
    engine: samples.map((s) => s.engineMs),
    shown: samples.map((s) => s.shownMs),
  };
}

/** (b) Navigation start → an editable element row and the first result on screen. */
async function interactive(page, url) {
  const times = [];
  for (let i = 0; i < LOADS; i += 1) {
    await page.goto(url);
    const t = await page.waitForFunction(
      () => {
        const editable = document.querySelector('[data-element] button:not([disabled])');
        const result = document.querySelector('[aria-labelledby="ws-results"] [data-result-path]');
        return editable && result ? performance.now() : false;
      },
      null,
      { polling: 'raf', timeout: 20_000 },
    );
    times.push(await t.jsonValue());
  }
  return times;
}

function machine() {
  let nproc = '?';
  try {
    nproc = execFileSync('nproc').toString().trim();
  } catch {
    nproc = String(cpus().length);
  }
  return { nproc, cpu: cpus()[0]?.model ?? 'unknown', chromium: '' };
}

async function main() {
  const browser = await openBrowser();
  try {
    const js = await initialJs(browser.context);
    const rows = [];
    for (const author of AUTHORS) {
      const page = await browser.context.newPage();
      await signIn(page, author);
      const me = await api(page, '/auth/me');
      const org = me.memberships.find((m) => m.orgSlug === DEMO_ORG_SLUG);
      const list = await api(
        page,
        `/orgs/${org.orgId}/worksheets?authorId=${me.user.id}&limit=100`,
      );
      for (const item of list.items) {
        const url = `${baseUrl}/o/${DEMO_ORG_SLUG}/worksheets/${item.id}`;
        const worksheet = await api(page, `/orgs/${org.orgId}/worksheets/${item.id}`);
        const loads = await interactive(page, url);
        const typed = await keystrokes(page, worksheet);
        rows.push({ title: item.title, loads, typed });
      }
      await page.close();
    }

    const m = machine();
    m.chromium = browser.context.browser()?.version() ?? '';
    console.log(`Machine: ${m.nproc} CPUs (nproc), ${m.cpu}; Chromium ${m.chromium}; ${baseUrl}`);
    console.log('');
    console.log(
      `(a) preview after a keystroke (${KEYSTROKES} keystrokes each) and (b) interactive (median of ${LOADS} loads)`,
    );
    const header = [
      'worksheet',
      'engine median',
      'engine p95',
      'key→shown median',
      'key→shown p95',
      'interactive median',
    ];
    const table = rows.map(({ title, loads, typed }) => [
      title,
      ms(median(typed?.engine ?? [])),
      ms(quantile(typed?.engine ?? [], 0.95)),
      ms(median(typed?.shown ?? [])),
      ms(quantile(typed?.shown ?? [], 0.95)),
      ms(median(loads)),
    ]);
    const widths = header.map((h, i) => Math.max(h.length, ...table.map((r) => r[i].length)));
    const line = (r) => `| ${r.map((c, i) => c.padEnd(widths[i])).join(' | ')} |`;
    console.log(line(header));
    console.log(`|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`);
    for (const r of table) console.log(line(r));
    const allEngine = rows.flatMap((r) => r.typed?.engine ?? []);
    const allShown = rows.flatMap((r) => r.typed?.shown ?? []);
    const allLoads = rows.flatMap((r) => r.loads);
    console.log(
      `all worksheets: engine median ${ms(median(allEngine))}, p95 ${ms(quantile(allEngine, 0.95))}; ` +
        `key→shown median ${ms(median(allShown))}, p95 ${ms(quantile(allShown, 0.95))}; ` +
        `interactive median ${ms(median(allLoads))}, worst ${ms(Math.max(...allLoads))}`,
    );
    console.log('');
    console.log('(c) JS loaded by /sign-in (gzip with zlib, default level)');
    for (const f of js) {
      console.log(
        `  ${f.path}  ${(f.raw / 1024).toFixed(1)} kB raw, ${(f.gzip / 1024).toFixed(1)} kB gzip`,
      );
    }
    const total = js.reduce((s, f) => s + f.gzip, 0);
    const raw = js.reduce((s, f) => s + f.raw, 0);
    console.log(
      `  total: ${js.length} files, ${(raw / 1024).toFixed(1)} kB raw, ${(total / 1024).toFixed(1)} kB gzip`,
    );
  } finally {
    await browser.close();
  }
}

await main();

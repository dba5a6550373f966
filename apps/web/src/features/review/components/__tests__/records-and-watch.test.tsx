import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import type { RevisionSummary, Signature } from '@biasproof/shared';
import {
  people,
  reviewServer,
  worksheetId,
  worksheetPath,
} from '@/features/review/components/__tests__/review-server.ts';
import { renderApp } from '@/test/render-app.tsx';

vi.setConfig({ testTimeout: 20_000 });

const revisionApi = (letter: string) =>
  `/api/orgs/org-resonant/worksheets/${worksheetId}/revisions/${letter}`;
const watchersMe = `/api/orgs/org-resonant/worksheets/${worksheetId}/watchers/me`;

function aSignature(revision: string): Signature {
  return {
    id: `sig-${revision}`,
    revision,
    signer: people.approver,
    printedName: people.approver.name,
    meaning: 'Approved for release',
    contentHash: 'a1'.repeat(32),
    signedAt: '2026-12-01T13:05:00.000Z',
    supersededAt: null,
  };
}

/** A link the browser downloads from (the `download` attribute, no file name of its own). */
function downloadHref(link: HTMLElement): string | null {
  expect(link.hasAttribute('download')).toBe(true);
  return link.getAttribute('href');
}

describe('records of a revision on the worksheet page', () => {
  it('when a member opens a signed-off worksheet, then its report and record package download from revision A’s addresses', async () => {
    reviewServer({ as: 'manager', state: 'signed_off', signatures: [aSignature('A')] });
    renderApp(worksheetPath);

    const records = await screen.findByRole(
      'list',
      { name: 'Records of revision A' },
      { timeout: 10_000 },
    );
    const report = within(records).getByRole('link', { name: 'Download report, revision A (PDF)' });
    expect(downloadHref(report)).toBe(`${revisionApi('A')}/report.pdf`);
    const pack = within(records).getByRole('link', {
      name: 'Download record package, revision A (zip)',
    });
    expect(downloadHref(pack)).toBe(`${revisionApi('A')}/record.zip`);
    expect(screen.queryByRole('link', { name: /not signed/ })).toBeNull();
  });

  it('when revision A is signed and B is the draft on screen, then B’s report link says it is not signed', async () => {
    reviewServer({ as: 'author', state: 'draft', revision: 'B', signatures: [aSignature('A')] });
    renderApp(worksheetPath);

    const records = await screen.findByRole(
      'list',
      { name: 'Records of revision B' },
      { timeout: 10_000 },
    );
    const report = within(records).getByRole('link', {
      name: 'Download report, revision B (PDF, not signed)',
    });
    expect(downloadHref(report)).toBe(`${revisionApi('B')}/report.pdf`);
    expect(
      downloadHref(within(records).getByRole('link', { name: /record package, revision B/ })),
    ).toBe(`${revisionApi('B')}/record.zip`);
  });
});

describe('records of each revision in the history', () => {
  it('when a member opens the history, then every revision has its own report and package links, unsigned ones marked', async () => {
    const summary = (letter: string, extra: Partial<RevisionSummary>): RevisionSummary => ({
      letter,
      state: 'returned',
      contentHash: `${letter.toLowerCase()}0`.repeat(32),
      frozen: true,
      engineVersion: '0.1.0',
      createdAt: '2026-11-28T09:00:00.000Z',
      createdBy: people.author,
      submittedAt: '2026-11-28T15:00:00.000Z',
      signatures: [],
      findingCount: 0,
      ...extra,
    });
    reviewServer({
      as: 'checker',
      state: 'signed_off',
      revision: 'B',
      routes: {
        'GET /api/orgs/org-resonant/worksheets/:id/revisions': () => ({
          status: 200,
          body: {
            items: [
              summary('A', {}),
              summary('B', { state: 'signed_off', signatures: [aSignature('B')] }),
            ],
            total: 2,
          },
        }),
        'GET /api/orgs/org-resonant/worksheets/:id/diff': () => ({
          status: 200,
          body: { from: 'A', to: 'B', inputs: [], results: [], tolerance: 1e-9 },
        }),
      },
    });
    renderApp(`${worksheetPath}/history`);

    const a = await screen.findByRole('article', { name: 'Revision A' }, { timeout: 10_000 });
    expect(
      downloadHref(
        within(a).getByRole('link', { name: 'Download report, revision A (PDF, not signed)' }),
      ),
    ).toBe(`${revisionApi('A')}/report.pdf`);
    expect(
      downloadHref(
        within(a).getByRole('link', { name: 'Download record package, revision A (zip)' }),
      ),
    ).toBe(`${revisionApi('A')}/record.zip`);

    const b = screen.getByRole('article', { name: 'Revision B' });
    expect(
      downloadHref(within(b).getByRole('link', { name: 'Download report, revision B (PDF)' })),
    ).toBe(`${revisionApi('B')}/report.pdf`);
    expect(
      downloadHref(
        within(b).getByRole('link', { name: 'Download record package, revision B (zip)' }),
      ),
    ).toBe(`${revisionApi('B')}/record.zip`);
  });
});

describe('watching a worksheet', () => {
  it('when the checker starts and stops watching, then the toggle flips and says who else watches', async () => {
    const { api, state } = reviewServer({
      as: 'checker',
      state: 'in_check',
      watchers: [people.manager],
    });
    const user = userEvent.setup();
    renderApp(worksheetPath);

    const toggle = await screen.findByRole('button', { name: 'Watch' }, { timeout: 10_000 });
    const who = () => document.getElementById(toggle.getAttribute('aria-describedby') ?? '');
    expect(toggle.getAttribute('aria-pressed')).toBe('false');
    expect(who()?.textContent).toBe(
      'Kofi Mensah watches this worksheet. Watchers receive the e-mail when it is signed off.',
    );

    await user.click(toggle);
    await waitFor(() => expect(toggle.getAttribute('aria-pressed')).toBe('true'));
    expect(who()?.textContent).toMatch(/^You and Kofi Mensah watch this worksheet\./);
    expect(api.requestsTo(`PUT ${watchersMe}`)).toHaveLength(1);
    expect(state.watchers.map((w) => w.name)).toEqual(['Kofi Mensah', 'Tomas Lindqvist']);

    await user.click(toggle);
    await waitFor(() => expect(toggle.getAttribute('aria-pressed')).toBe('false'));
    expect(who()?.textContent).toMatch(/^Kofi Mensah watches this worksheet\./);
    expect(api.requestsTo(`DELETE ${watchersMe}`)).toHaveLength(1);
    expect(state.watchers).toEqual([people.manager]);
  });

  it('when nobody watches and the author starts, then the text says only they watch', async () => {
    reviewServer({ as: 'author', state: 'draft' });
    const user = userEvent.setup();
    renderApp(worksheetPath);

    const toggle = await screen.findByRole('button', { name: 'Watch' }, { timeout: 10_000 });
    expect(screen.getByText(/^Nobody watches this worksheet yet\./)).toBeDefined();
    await user.click(toggle);
    expect(await screen.findByText(/^You watch this worksheet\./)).toBeDefined();
    expect(toggle.getAttribute('aria-pressed')).toBe('true');
  });
});

import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import type { RevisionDiff, RevisionSummary } from '@biasproof/shared';
import {
  reviewServer,
  worksheetId,
  worksheetPath,
} from '@/features/review/components/__tests__/review-server.ts';
import { renderApp } from '@/test/render-app.tsx';

vi.setConfig({ testTimeout: 20_000 });

const ines = { id: 'user-ines', name: 'Ines Okafor' };
function aRevision(letter: string, extra: Partial<RevisionSummary>): RevisionSummary {
  return {
    letter,
    state: 'returned',
    contentHash: `${letter.toLowerCase()}0`.repeat(32),
    frozen: true,
    engineVersion: '0.1.0',
    createdAt: '2026-11-28T09:00:00.000Z',
    createdBy: ines,
    submittedAt: '2026-11-28T15:00:00.000Z',
    signatures: [],
    findingCount: 0,
    ...extra,
  };
}

const revisions = [
  aRevision('A', { findingCount: 2 }),
  aRevision('B', { state: 'superseded', createdAt: '2026-11-29T09:00:00.000Z' }),
  aRevision('C', {
    state: 'signed_off',
    createdAt: '2026-11-30T09:00:00.000Z',
    signatures: [
      {
        id: 'sig-1',
        revision: 'C',
        signer: { id: 'user-priya', name: 'Priya Raman' },
        printedName: 'Priya Raman',
        meaning: 'Approved for release',
        contentHash: 'c0'.repeat(32),
        signedAt: '2026-12-01T13:05:00.000Z',
        supersededAt: null,
      },
    ],
  }),
];

function diffOf(from: string, to: string): RevisionDiff {
  return {
    from,
    to,
    inputs: [
      {
        path: 'elements.r1.value',
        change: 'changed',
        before: 1000,
        after: 1200,
        delta: 200,
        relative: 0.2,
      },
    ],
    results: [
      {
        path: 'results.devices.d1.id',
        change: 'changed',
        before: 4.3e-3,
        after: 3.6e-3,
        delta: -0.7e-3,
        relative: -0.7 / 4.3,
      },
    ],
    tolerance: 1e-9,
  };
}

describe('the history of a worksheet', () => {
  it('when a member opens the history, then every revision shows who, when, state, hash and signatures, and two chosen revisions are compared number by number', async () => {
    const { api } = reviewServer({
      as: 'manager',
      state: 'signed_off',
      revision: 'C',
      routes: {
        [`GET /api/orgs/org-resonant/worksheets/:id/revisions`]: () => ({
          status: 200,
          body: { items: revisions, total: 3 },
        }),
        [`GET /api/orgs/org-resonant/worksheets/:id/diff`]: ({ query }) => ({
          status: 200,
          body: diffOf(query.get('from') ?? '', query.get('to') ?? ''),
        }),
      },
    });
    const user = userEvent.setup();
    const { router } = renderApp(worksheetPath);
    await user.click(
      await screen.findByRole('link', { name: 'History and differences' }, { timeout: 10_000 }),
    );

    expect(
      await screen.findByRole(
        'heading',
        { level: 1, name: 'History of Input clamp, channel A' },
        { timeout: 10_000 },
      ),
    ).toBeDefined();
    const a = await screen.findByRole('article', { name: 'Revision A' });
    expect(a.textContent).toMatch(/Returned.*frozen · 2 findings/);
    expect(a.textContent).toContain('Ines Okafor, 2026-11-28 10:00 Europe/Berlin (GMT+01:00)');
    expect(a.textContent).toContain('a0a0a0a0a0a0…');
    const c = screen.getByRole('article', { name: 'Revision C' });
    expect(
      within(c).getByRole('figure', { name: 'Signature of Priya Raman' }).textContent,
    ).toContain('Approved for release');

    // The latest two are compared first.
    const inputs = await screen.findByRole('table', { name: /Inputs changed/ });
    expect(within(inputs).getByRole('row', { name: /elements\.r1\.value/ }).textContent).toBe(
      'elements.r1.value1 k1.2 k',
    );
    const moved = screen.getByRole('table', { name: /Results moved/ });
    expect(within(moved).getByRole('row', { name: /results\.devices\.d1\.id/ }).textContent).toBe(
      'results.devices.d1.id4.3 mA3.6 mA-700 µA-16.3 %',
    );
    expect(
      api
        .requestsTo(`GET /api/orgs/org-resonant/worksheets/${worksheetId}/diff`)[0]
        ?.query.toString(),
    ).toBe('from=B&to=C');

    await user.selectOptions(screen.getByLabelText('From revision'), 'A');
    await waitFor(() => expect(router.state.location.search).toBe('?from=A'));
    await waitFor(() =>
      expect(
        api
          .requestsTo(`GET /api/orgs/org-resonant/worksheets/${worksheetId}/diff`)
          .map((r) => r.query.toString()),
      ).toContain('from=A&to=C'),
    );
  });
});

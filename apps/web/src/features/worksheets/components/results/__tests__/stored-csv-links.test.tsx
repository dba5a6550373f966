import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import {
  aWorksheet,
  worksheetId,
} from '@/features/worksheets/components/__tests__/stored-worksheet-kit.ts';
import {
  circuitPanel,
  elementRow,
  fill,
  renderWorksheet,
  submit,
  type User,
} from '@/features/worksheets/components/__tests__/worksheet-test-kit.tsx';
import { list, meOf, orgs, stubApi, type FakeAnswer } from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';

const resultsCsv = `/api/orgs/org-resonant/worksheets/${worksheetId}/revisions/A/results.csv`;

function resultsPanel(): HTMLElement {
  return screen.getByRole('region', { name: 'Results' });
}

/** The "Download CSV" link of the results table titled `title`, if it has one. */
function downloadOf(title: string): HTMLElement | null {
  const table = within(resultsPanel()).getByRole('region', { name: title });
  const link = within(table).queryByRole('link', { name: /^Download CSV/ });
  if (link) expect(link.hasAttribute('download')).toBe(true);
  return link;
}

async function setR1(user: User, value: string) {
  await user.click(within(elementRow('R1')).getByRole('button', { name: 'Edit R1' }));
  const form = within(circuitPanel()).getByRole('region', { name: 'Edit R1' });
  await fill(user, form, { 'Resistance (Ω)': value });
  await submit(user, form, 'Save changes');
}

describe('stored results tables as CSV', () => {
  it('when the stored results are shown, then each table offers the server’s CSV of revision A, and a local preview offers only the copy', async () => {
    stubApi({
      'GET /api/auth/me': () => ({
        status: 200,
        body: meOf({}, [{ ...orgs.resonant, roles: ['author'] }]),
      }),
      'GET /api/orgs/org-resonant/worksheets/:id': () => ({ status: 200, body: aWorksheet() }),
      'GET /api/orgs/org-resonant/models': () => ({ status: 200, body: list([]) }),
      // The edit's save never ends: the results stay a local preview.
      'PATCH /api/orgs/org-resonant/worksheets/:id': () => new Promise<FakeAnswer>(() => undefined),
    });
    const user = userEvent.setup();
    renderApp(`/o/resonant-labs/worksheets/${worksheetId}`);
    await waitFor(() => expect(within(resultsPanel()).getByText('Stored results')).toBeDefined(), {
      timeout: 10_000,
    });

    const nodes = downloadOf('Node voltages');
    expect(nodes?.getAttribute('href')).toBe(`${resultsCsv}?table=bias`);
    expect(nodes?.getAttribute('aria-label')).toBe(
      'Download CSV of the stored bias point (node voltages, element currents and powers, supply power), revision A',
    );
    expect(downloadOf('Resistors, capacitors and inductors')?.getAttribute('href')).toBe(
      `${resultsCsv}?table=bias`,
    );
    expect(downloadOf('Diodes')?.getAttribute('href')).toBe(`${resultsCsv}?table=devices`);

    await user.click(screen.getByRole('tab', { name: 'Small-signal' }));
    const atFrequency = within(resultsPanel()).getByRole('region', { name: /^At \d/ });
    expect(
      within(atFrequency)
        .getByRole('link', { name: /^Download CSV/ })
        .getAttribute('href'),
    ).toBe(`${resultsCsv}?table=small-signal`);
    expect(downloadOf('Frequency response')?.getAttribute('href')).toBe(
      `${resultsCsv}?table=sweep`,
    );
    expect(downloadOf('Diode parameters at Q')?.getAttribute('href')).toBe(
      `${resultsCsv}?table=devices`,
    );

    await user.click(screen.getByRole('tab', { name: 'Bias point' }));
    await setR1(user, '2k2');
    expect(within(resultsPanel()).getByText('Local preview')).toBeDefined();
    expect(downloadOf('Node voltages')).toBeNull();
    expect(within(resultsPanel()).queryAllByRole('link', { name: /^Download CSV/ })).toEqual([]);
    expect(
      within(resultsPanel()).getByRole('button', { name: 'Copy “Node voltages” as CSV' }),
    ).toBeDefined();
  });

  it('when a scratch worksheet is open, then its tables offer only the copy', async () => {
    renderWorksheet();
    await waitFor(() =>
      expect(
        within(resultsPanel()).getByRole('button', { name: 'Copy “Node voltages” as CSV' }),
      ).toBeDefined(),
    );
    expect(within(resultsPanel()).queryAllByRole('link', { name: /^Download CSV/ })).toEqual([]);
  });
});

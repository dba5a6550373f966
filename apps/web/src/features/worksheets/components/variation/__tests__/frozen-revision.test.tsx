import { screen, waitFor, within } from '@testing-library/react';
import { computeWorksheet, formatValue, type WorksheetVariationInput } from '@biasproof/calc';
import { describe, expect, it } from 'vitest';
import {
  aWorksheet,
  worksheetId,
} from '@/features/worksheets/components/__tests__/stored-worksheet-kit.ts';
import { resultText } from '@/features/worksheets/components/__tests__/worksheet-test-kit.tsx';
import {
  divider,
  onePercent,
  resultsPanel,
} from '@/features/worksheets/components/variation/__tests__/variation-test-kit.ts';
import { list, meOf, orgs, stubApi } from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';
import userEvent from '@testing-library/user-event';

const recorded: WorksheetVariationInput = {
  ...onePercent,
  limits: [{ path: 'nodes.out', min: 4.98, max: 5.02, unit: 'V' }],
  monteCarlo: { samples: 300, seed: 'rev-A' },
};

describe('a frozen revision’s variation results', () => {
  it('when a checker opens a worksheet in check, then the setup, limits and the stored Monte Carlo are shown read-only and rerunning the recorded seed gives the same numbers', async () => {
    const draft = divider(recorded);
    const stored = aWorksheet(draft, { state: 'in_check', version: 3 });
    stubApi({
      'GET /api/auth/me': () => ({
        status: 200,
        body: meOf({}, [{ ...orgs.resonant, roles: ['checker'] }]),
      }),
      'GET /api/orgs/org-resonant/worksheets/:id': () => ({ status: 200, body: stored }),
      'GET /api/orgs/org-resonant/models': () => ({ status: 200, body: list([]) }),
    });
    const user = userEvent.setup();
    renderApp(`/o/resonant-labs/worksheets/${worksheetId}`);
    await screen.findByRole(
      'heading',
      { level: 1, name: 'Input clamp, channel A' },
      { timeout: 10_000 },
    );
    await waitFor(() => expect(within(resultsPanel()).getByText('Stored results')).toBeDefined(), {
      timeout: 10_000,
    });

    await user.click(within(resultsPanel()).getByRole('tab', { name: 'Variation' }));
    const view = within(resultsPanel()).getByRole('tabpanel');
    expect(within(view).getByLabelText('What varies, row 1').matches(':disabled')).toBe(true);
    expect(within(view).queryByRole('button', { name: 'Add varied parameter' })).toBeNull();
    expect(within(view).queryByRole('button', { name: /^Apply/ })).toBeNull();

    const results = computeWorksheet(draft);
    if (results.status !== 'solved' || !results.variation?.monteCarlo.ok)
      throw new Error('the stored results hold a Monte Carlo');
    const storedYield = formatValue(results.variation.monteCarlo.value.yield!.fraction * 100, '%');
    expect(within(view).getByText(/From the worksheet’s results/).textContent).toContain(
      '300 samples, seed “rev-A”',
    );
    expect(resultText('variation.monteCarlo.yield')).toBe(storedYield);

    await user.click(within(view).getByRole('button', { name: 'Run the recorded Monte Carlo' }));
    expect(
      await within(view).findByText(/Run in this browser/, {}, { timeout: 20_000 }),
    ).toBeDefined();
    expect(resultText('variation.monteCarlo.yield')).toBe(storedYield);

    await user.click(within(resultsPanel()).getByRole('tab', { name: 'Limits and checks' }));
    const limits = within(resultsPanel()).getByRole('tabpanel');
    expect(within(limits).queryByRole('button', { name: 'Add limit' })).toBeNull();
    expect(within(limits).queryByRole('button', { name: /^Edit/ })).toBeNull();
    expect(resultText('variation.limits.nodes.out.yield')).toBe(storedYield);
  });
});

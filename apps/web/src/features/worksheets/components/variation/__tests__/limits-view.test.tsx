import { screen, waitFor, within } from '@testing-library/react';
import { formatValue, runMonteCarlo, type LimitInput } from '@biasproof/calc';
import { describe, expect, it } from 'vitest';
import {
  fill,
  renderWorksheet,
  resultText,
  valueOf,
} from '@/features/worksheets/components/__tests__/worksheet-test-kit.tsx';
import {
  divider,
  onePercent,
  openView,
} from '@/features/worksheets/components/variation/__tests__/variation-test-kit.ts';

describe('the limits view', () => {
  it('when the author adds and edits a limit, then nominal and worst-corner chips show pass or fail with their margins', async () => {
    const { user } = renderWorksheet(() => divider(onePercent));
    const view = await openView(user, 'Limits and checks');
    expect(within(view).getByText('No limits yet.')).toBeDefined();

    await user.click(within(view).getByRole('button', { name: 'Add limit' }));
    let form = within(view).getByRole('region', { name: 'New limit' });
    await user.click(within(form).getByRole('button', { name: 'Add limit' }));
    expect(within(form).getByText('Enter a result path, e.g. nodes.out.')).toBeDefined();
    expect(within(form).getByText('Give a min, a max or both.')).toBeDefined();
    await fill(user, form, { 'Result path': 'node.out' });
    await user.click(within(form).getByRole('button', { name: 'Add limit' }));
    expect(await within(form).findByText(/result path 'node\.out'/)).toBeDefined();

    await fill(user, form, { 'Result path': 'nodes.out', Min: '4.9', Max: '5.1' });
    expect(valueOf(within(form).getByLabelText('Unit'))).toBe('V');
    await user.click(within(form).getByRole('button', { name: 'Add limit' }));
    await waitFor(() => expect(form.isConnected).toBe(false));

    const row = within(view).getByRole('row', { name: /^nodes\.out/ });
    expect(row.textContent).toContain('4.9 V to 5.1 V');
    // Nominal 5 V is 100 mV inside both bounds: the margin is to the min, 0.1/4.9 = 2.04 %.
    await waitFor(() =>
      expect(resultText('variation.limits.nodes.out.nominal')).toBe(
        '✓ Pass margin +100 mV (+2.04 %)',
      ),
    );
    // Worst corner 4.95 V (10 V · 9.9k/20k, hand calculation): 50 mV above the min.
    expect(resultText('variation.limits.nodes.out.worstCorner')).toMatch(
      /^✓ Pass margin \+50 mV .*, at the min corner$/,
    );

    await user.click(within(row).getByRole('button', { name: 'Edit the limit on nodes.out' }));
    form = within(view).getByRole('region', { name: 'Edit the limit on nodes.out' });
    await fill(user, form, { Min: '4.97' });
    await user.click(within(form).getByRole('button', { name: 'Save limit' }));
    await waitFor(() =>
      expect(resultText('variation.limits.nodes.out.worstCorner')).toMatch(/^✗ Fail margin −20 mV/),
    );
    expect(resultText('variation.limits.nodes.out.nominal')).toMatch(/^✓ Pass margin \+30 mV/);

    await user.click(within(view).getByRole('button', { name: 'Delete the limit on nodes.out' }));
    expect(within(view).getByText('No limits yet.')).toBeDefined();
    await user.click(screen.getByRole('button', { name: 'Undo' }));
    expect(within(view).getByRole('row', { name: /^nodes\.out/ }).textContent).toContain(
      '4.97 V to 5.1 V',
    );
  });

  it('when the author adds a hand check, then its deviation and pass or fail sit beside the limits', async () => {
    const { user } = renderWorksheet(() => divider(onePercent));
    const view = await openView(user, 'Limits and checks');
    await user.click(within(view).getByRole('button', { name: 'Add hand check' }));
    let form = within(view).getByRole('region', { name: 'New hand check' });
    await fill(user, form, {
      'Result path': 'nodes.out',
      'Expected value': '0',
      'Tolerance (%)': '1',
    });
    await user.click(within(form).getByRole('button', { name: 'Add check' }));
    expect(within(form).getByText('A % deviation needs a value other than 0.')).toBeDefined();
    await fill(user, form, { 'Expected value': '5.1', Note: 'V·R2/(R1+R2), rounded up' });
    await user.click(within(form).getByRole('button', { name: 'Add check' }));

    // (5 − 5.1)/5.1 = −1.96 %: outside ±1 %.
    await waitFor(() =>
      expect(resultText('variation.handChecks.nodes.out.deviation')).toBe('✗ Fail −1.96 % (±1 %)'),
    );
    expect(resultText('variation.handChecks.nodes.out.actual')).toBe('5 V');
    const row = within(view).getByRole('row', { name: /^nodes\.out/ });
    expect(row.textContent).toContain('V·R2/(R1+R2), rounded up');

    await user.click(within(row).getByRole('button', { name: 'Edit the hand check of nodes.out' }));
    form = within(view).getByRole('region', { name: 'Edit the hand check of nodes.out' });
    await fill(user, form, { 'Tolerance (%)': '2' });
    await user.click(within(form).getByRole('button', { name: 'Save check' }));
    await waitFor(() =>
      expect(resultText('variation.handChecks.nodes.out.deviation')).toBe('✓ Pass −1.96 % (±2 %)'),
    );
  });

  it('when a Monte Carlo has run, then each limit shows the share of samples within it', async () => {
    const limits: LimitInput[] = [
      { path: 'nodes.out', min: 4.97, unit: 'V' },
      { path: 'nodes.out', max: 5.02, unit: 'V' },
    ];
    const { user } = renderWorksheet(() => divider({ ...onePercent, limits }));
    let view = await openView(user, 'Limits and checks');
    expect(within(view).getAllByText('— (no Monte Carlo run)')).toHaveLength(2);

    view = await openView(user, 'Variation');
    const run = within(view).getByRole('form', { name: 'Monte Carlo run' });
    await fill(user, run, { Samples: '300', Seed: 'limits-1' });
    await user.click(within(run).getByRole('button', { name: 'Run Monte Carlo' }));
    await within(view).findByTestId('monte-carlo-result', {}, { timeout: 20_000 });

    view = await openView(user, 'Limits and checks');
    const draft = divider({ ...onePercent, limits });
    const engine = runMonteCarlo({
      circuit: draft.circuit,
      settings: draft.settings,
      parameters: onePercent.parameters!,
      probes: ['nodes.out'],
      samples: 300,
      seed: 'limits-1',
      limits,
    });
    const [low, high] = engine.yield!.limits;
    expect(resultText('variation.limits.nodes.out.yield')).toBe(
      formatValue(low!.fraction * 100, '%'),
    );
    expect(resultText('variation.limits.nodes.out#2.yield')).toBe(
      formatValue(high!.fraction * 100, '%'),
    );
    expect(high!.fraction).toBeLessThan(1);
  });
});

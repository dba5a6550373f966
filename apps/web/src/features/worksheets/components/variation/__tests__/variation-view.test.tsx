import { screen, waitFor, within } from '@testing-library/react';
import { formatValue } from '@biasproof/calc';
import { describe, expect, it } from 'vitest';
import {
  elementRow,
  fill,
  renderWorksheet,
  resultText,
} from '@/features/worksheets/components/__tests__/worksheet-test-kit.tsx';
import { formatResult } from '@/features/worksheets/components/results/result-format.ts';
import {
  divider,
  onePercent,
  openView,
  rawResult,
} from '@/features/worksheets/components/variation/__tests__/variation-test-kit.ts';

describe('the variation view', () => {
  it('when the author varies R1 and R2 by 1 % and lists temperatures, then corners, sensitivities, RSS and the sweep are the hand-calculated ones', async () => {
    const { user } = renderWorksheet(() => divider());
    const view = await openView(user, 'Variation');
    const setup = within(view).getByRole('form', { name: 'Variation setup' });

    await user.click(within(setup).getByRole('button', { name: 'Add varied parameter' }));
    await user.selectOptions(within(setup).getByLabelText('What varies, row 1'), 'R1');
    await user.click(within(setup).getByRole('button', { name: 'Add varied parameter' }));
    await user.selectOptions(within(setup).getByLabelText('What varies, row 2'), 'R2');
    await fill(user, setup, { 'Tempco (ppm/K) of R1': '100', 'Other result paths': 'nodes.out' });
    await fill(user, setup, { 'Temperatures (°C)': '-40, 27, 125' });

    // Divider at its corners: 10 V · 9.9k / (10.1k + 9.9k) = 4.95 V and 5.05 V (hand calculation).
    await waitFor(() => expect(resultText('variation.corners.nodes.out.min')).toBe('4.95 V'));
    expect(resultText('variation.corners.nodes.out.max')).toBe('5.05 V');
    const corners = within(view).getByRole('table', {
      name: 'Lowest and highest over the corners',
    });
    expect(within(corners).getByRole('row', { name: /^nodes\.out/ }).textContent).toContain(
      'R1 high, R2 low',
    );
    // Normalized sensitivities of R2/(R1 + R2): +R1/(R1 + R2) = +0.5 to R2, −0.5 to R1.
    expect(resultText('variation.sensitivities.nodes.out.r1')).toBe(formatResult(-0.5, ''));
    expect(resultText('variation.sensitivities.nodes.out.r2')).toBe(formatResult(0.5, ''));
    // RSS (issue 6: σy = √Σ(∂y/∂xᵢ·σᵢ)²): ∂V/∂R = ∓10·10k/20k² = 2.5e-4 V/Ω, σR = 100 Ω/3.
    const sigma = Math.sqrt(2) * 2.5e-4 * (100 / 3);
    expect(rawResult('variation.rss.nodes.out.sigma')).toBeCloseTo(sigma, 6);
    expect(within(view).getByText(/RSS is a first-order estimate/)).toBeDefined();
    // R1 at 125 °C with 100 ppm/K about 27 °C: 10k·(1 + 98e-4) = 10.098 kΩ (first-order tempco).
    expect(resultText('variation.temperatures.125.nodes.out')).toBe(
      formatValue((10 * 10_000) / (10_000 + 10_098), 'V'),
    );
    expect(resultText('variation.temperatures.27.nodes.out')).toBe('5 V');
    expect(
      await within(view).findByRole(
        'img',
        { name: /Normalized sensitivities of nodes\.out/ },
        { timeout: 10_000 },
      ),
    ).toBeDefined();
  });

  it('when parts are rated, then each stress reads pass, warn or fail in words; applying a standard value changes the part and undo takes it back', async () => {
    const { user } = renderWorksheet(() =>
      divider({ ...onePercent, ratings: [{ element: 'R1', power: 4e-3 }] }, 10_200),
    );
    const view = await openView(user, 'Variation');
    const setup = within(view).getByRole('form', { name: 'Variation setup' });
    await user.click(within(setup).getByRole('button', { name: 'Add part rating' }));
    await user.selectOptions(within(setup).getByLabelText('Rated part, row 2'), 'R2');
    await fill(user, setup, { 'Power (W) rating of R2': '2m' });

    // I = 10 V / 20.2 kΩ: P(R1) = I²·10.2k ≈ 2.50 mW, between 0.6 × 4 mW (film-resistor
    // derating, NASA EEE-INST-002 as the policy quotes it) and 4 mW: warn. P(R2) ≈ 2.45 mW > 2 mW: fail.
    await waitFor(() => expect(resultText('variation.stress.r2.power.status')).toBe('✗ Fail'));
    expect(resultText('variation.stress.r1.power.status')).toBe('⚠ Warn');
    expect(resultText('variation.stress.r1.power')).toBe(
      formatValue((10 / 20_200) ** 2 * 10_200, 'W'),
    );

    // IEC 60063: 10.2 kΩ is an E96 value; the nearest E24 value is 10 kΩ.
    expect(resultText('variation.standardValues.r1.E24')).toBe('10 kΩ');
    expect(resultText('variation.standardValues.r1.E96')).toBe('10.2 kΩ');
    await user.click(within(view).getByRole('button', { name: 'Apply 10 kΩ (E24) to R1' }));
    expect(elementRow('R1').textContent).toContain('10 kΩ');
    await waitFor(() => expect(resultText('variation.standardValues.r1.E96')).toBe('10 kΩ'));
    expect(screen.getByRole('button', { name: 'Undo' }).getAttribute('title')).toBe(
      'Undo: change R1 (Ctrl+Z)',
    );
    await user.click(screen.getByRole('button', { name: 'Undo' }));
    expect(elementRow('R1').textContent).toContain('10.2 kΩ');
  });

  it('when the analysis settings change, then the variation setup stays in the draft', async () => {
    const { user } = renderWorksheet(() => divider(onePercent));
    const temperature = screen.getByLabelText('Temperature (°C)');
    await user.clear(temperature);
    await user.type(temperature, '50');
    const view = await openView(user, 'Variation');
    expect(within(view).getByLabelText('What varies, row 1')).toHaveProperty('value', 'R1');
    expect(within(view).getByLabelText('What varies, row 2')).toHaveProperty('value', 'R2');
    await waitFor(() => expect(resultText('variation.corners.nodes.out.max')).toBe('5.05 V'));
  });

  it('when a setup field is wrong, then it says why and the last valid setup stays', async () => {
    const { user } = renderWorksheet(() => divider(onePercent));
    const view = await openView(user, 'Variation');
    await waitFor(() => expect(resultText('variation.corners.nodes.out.max')).toBe('5.05 V'));
    const setup = within(view).getByRole('form', { name: 'Variation setup' });
    // Every keystroke that makes a valid setup applies: '-' and '-5' are both wrong.
    await user.tripleClick(within(setup).getByLabelText('Tolerance (%) of R1'));
    await user.keyboard('-5');
    expect(await within(setup).findByText('Between 0 and 99 %.')).toBeDefined();
    await fill(user, setup, { 'Other result paths': 'node.out' });
    expect(await within(setup).findByText(/result path 'node.out'/)).toBeDefined();
    expect(resultText('variation.corners.nodes.out.max')).toBe('5.05 V');
  });
});

import { screen, waitFor, within } from '@testing-library/react';
import {
  compareDiodeLaws,
  formatValue,
  solveOperatingPoint,
  type CircuitInput,
} from '@biasproof/calc';
import { describe, expect, it } from 'vitest';
import {
  expectResult,
  renderWorksheet,
  resultText,
} from '@/features/worksheets/components/__tests__/worksheet-test-kit.tsx';
import { formatPercentDifference } from '@/features/worksheets/components/results/result-format.ts';

const starter: CircuitInput = {
  elements: [
    { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 5 },
    { kind: 'R', name: 'R1', nodes: ['in', 'out'], value: 1000 },
    { kind: 'D', name: 'D1', nodes: ['out', '0'], model: 'DSIG' },
  ],
  models: [{ name: 'DSIG', kind: 'D', params: { IS: 1e-14, N: 1 } }],
};

function comparisonTable(): HTMLElement {
  return screen.getByRole('table', { name: 'Diode-law comparison' });
}

describe('choosing the diode law', () => {
  it('when the author switches to constant drop and changes VON, then the bias point and the comparison follow', async () => {
    const { user } = renderWorksheet();
    const exponential = compareDiodeLaws(starter);
    await expectResult('nodes.out', exponential.reference.nodes.out!, 'V');
    expect(
      within(comparisonTable()).getByRole('columnheader', {
        name: 'Exponential (Shockley) (in use)',
      }),
    ).toBeDefined();
    const pwl = exponential.laws.find((l) => l.law === 'piecewise-linear')!;
    expect(resultText('comparison.piecewise-linear.nodes.out')).toBe(
      formatValue(pwl.operatingPoint!.nodes.out!, 'V'),
    );
    expect(resultText('comparison.piecewise-linear.devices.d1.current.diffPercent')).toBe(
      formatPercentDifference(pwl.currentDifferencePercent.d1!),
    );

    await user.click(screen.getByRole('radio', { name: 'Constant drop' }));
    await waitFor(() => expect(resultText('diodeLaw')).toBe('Constant drop'));
    // Constant-drop hand analysis: V(out) = VON, ID = (5 V − 0.7 V) / 1 kΩ.
    await expectResult('nodes.out', 0.7, 'V');
    await expectResult('devices.d1.id', (5 - 0.7) / 1000, 'A');
    expect(resultText('method')).toBe('Assumed-state iteration');
    expect(
      within(comparisonTable()).getByRole('columnheader', { name: 'Constant drop (in use)' }),
    ).toBeDefined();
    expect(
      within(comparisonTable()).queryByRole('columnheader', { name: /Exponential.*in use/ }),
    ).toBeNull();

    const von = screen.getByLabelText('Constant-drop VON (V)');
    await user.clear(von);
    await user.type(von, '650m');
    const engine = solveOperatingPoint(starter, {
      diodeLaw: 'constant-drop',
      constantDrop: { vOn: 0.65 },
    });
    await expectResult('nodes.out', 0.65, 'V');
    await expectResult('devices.d1.id', (engine.devices.d1 as { id: number }).id, 'A');
    const compared = compareDiodeLaws(starter, { constantDrop: { vOn: 0.65 } }).laws.find(
      (l) => l.law === 'constant-drop',
    )!;
    await waitFor(() =>
      expect(resultText('comparison.constant-drop.nodes.out.diffPercent')).toBe(
        formatPercentDifference(compared.nodeDifferencePercent.out!),
      ),
    );
  });

  it('when a law value is not a voltage, then the field says so and the bias point keeps the last valid law', async () => {
    const { user } = renderWorksheet();
    await user.click(screen.getByRole('radio', { name: 'Constant drop' }));
    await expectResult('nodes.out', 0.7, 'V');
    const von = screen.getByLabelText('Constant-drop VON (V)');
    await user.clear(von);
    await user.type(von, '0.7A');
    expect(
      await screen.findByText("'0.7A' is not a value in V: it ends in 'A' where V was expected"),
    ).toBeDefined();
    // Typing passes through valid values (0, 0.7) whose previews may still be on their way.
    await expectResult('nodes.out', 0.7, 'V');
  });
});

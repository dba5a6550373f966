import { screen, waitFor, within } from '@testing-library/react';
import {
  checkSignalSize,
  formatValue,
  loadLine,
  smallSignalAt,
  type CircuitInput,
} from '@biasproof/calc';
import { describe, expect, it } from 'vitest';
import {
  elementRow,
  expectResult,
  fill,
  renderWorksheet,
  resultText,
} from '@/features/worksheets/components/__tests__/worksheet-test-kit.tsx';
import { formatResult } from '@/features/worksheets/components/results/result-format.ts';

const starter: CircuitInput = {
  elements: [
    { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 5 },
    { kind: 'R', name: 'R1', nodes: ['in', 'out'], value: 1000 },
    { kind: 'D', name: 'D1', nodes: ['out', '0'], model: 'DSIG' },
  ],
  models: [{ name: 'DSIG', kind: 'D', params: { IS: 1e-14, N: 1 } }],
};

describe('results views', () => {
  it('when the author opens each view, then gain, impedances, signal size and load line are the engine’s', async () => {
    const { user } = renderWorksheet();
    await waitFor(() => expect(resultText('nodes.out')).not.toBeNull());

    await user.click(screen.getByRole('tab', { name: 'Small-signal' }));
    const ss = smallSignalAt(starter, { input: 'V1', output: 'out', frequency: 1000 });
    expect(resultText('gain.vv')).toBe(formatResult(ss.gain.mag, 'V/V'));
    expect(resultText('gain.db')).toBe(formatValue(ss.gain.db, 'dB'));
    expect(resultText('zin.ohm')).toBe(formatValue(ss.zin.mag, 'Ω'));
    expect(resultText('zout.ohm')).toBe(formatValue(ss.zout.mag, 'Ω'));
    expect(resultText('smallSignal.devices.d1.rd')).toBe(
      formatValue((ss.devices.d1 as { rd: number }).rd, 'Ω'),
    );
    expect(resultText('sweep.midbandDb')).toBe(formatValue(ss.gain.db, 'dB'));
    expect(resultText('sweep.lowCornerHz')).toBe('—');
    // The plots load as their own chunk: allow for it on a cold start.
    expect(
      await screen.findByRole(
        'img',
        { name: /Magnitude in dB against frequency/ },
        { timeout: 10_000 },
      ),
    ).toBeDefined();

    await user.click(screen.getByRole('tab', { name: 'Signal size' }));
    const size = checkSignalSize(starter, { input: 'V1', output: 'out', amplitude: 5e-3 });
    expect(resultText('signalSize.pass')).toBe('Pass');
    expect(resultText('signalSize.errorPercent')).toBe(formatValue(size.errorPercent, '%'));
    expect(resultText('signalSize.ports.d1.D.swing')).toBe(formatValue(size.ports[0]!.swing, 'V'));

    await user.click(screen.getByRole('tab', { name: 'Load line' }));
    const picture = loadLine(starter, { device: 'D1' });
    expect(resultText('loadLine.d1.q.v')).toBe(formatValue(picture.q.v, 'V'));
    expect(resultText('loadLine.d1.thevenin.resistance')).toBe(
      formatValue(picture.thevenin.resistance, 'Ω'),
    );
    expect(
      await screen.findByRole('img', { name: /D1 load-line plot/ }, { timeout: 10_000 }),
    ).toBeDefined();
    expect(screen.getByText('Junction voltage VD (V)')).toBeDefined();
    expect(screen.getByText('Diode current ID (A)')).toBeDefined();
  });

  it('when the arrow keys move along the views, then each view opens in turn', async () => {
    const { user } = renderWorksheet();
    const bias = await screen.findByRole('tab', { name: 'Bias point' });
    await user.click(bias);
    await user.keyboard('{ArrowRight}');
    expect(screen.getByRole('tab', { name: 'Small-signal' }).getAttribute('aria-selected')).toBe(
      'true',
    );
    expect(document.activeElement).toBe(screen.getByRole('tab', { name: 'Small-signal' }));
    await user.keyboard('{End}');
    expect(
      screen.getByRole('tab', { name: 'Limits and checks' }).getAttribute('aria-selected'),
    ).toBe('true');
    await user.keyboard('{ArrowRight}');
    expect(screen.getByRole('tab', { name: 'Bias point' }).getAttribute('aria-selected')).toBe(
      'true',
    );
  });

  it('when a table is copied, then the clipboard holds its CSV with full-precision numbers', async () => {
    const { user } = renderWorksheet();
    await waitFor(() => expect(resultText('nodes.out')).not.toBeNull());
    await user.click(screen.getByRole('button', { name: 'Copy “Node voltages” as CSV' }));
    expect(await screen.findByText('Copied 2 rows of “Node voltages” as CSV.')).toBeDefined();
    const csv = await navigator.clipboard.readText();
    const [head, first, second] = csv.trim().split('\r\n');
    expect(head).toBe('Node,Voltage (V)');
    expect(first).toBe('in,5');
    expect(second).toMatch(/^out,0\.69288\d+$/);
  });

  it('when a part is being edited, then the results preview the typed value and go back on cancel', async () => {
    const { user } = renderWorksheet();
    await expectResult('nodes.in', 5, 'V');
    await user.click(within(elementRow('R1')).getByRole('button', { name: 'Edit R1' }));
    const form = screen.getByRole('region', { name: 'Edit R1' });
    await fill(user, form, { 'Resistance (Ω)': '2k2' });
    expect(await screen.findByText('Includes unsaved changes to R1.')).toBeDefined();
    const r1 = 2200;
    await waitFor(() => {
      const current = Number(
        document
          .querySelector('[data-result-path="elements.r1.current"]')
          ?.getAttribute('title')
          ?.split(' ')[0],
      );
      const vout = Number(
        document
          .querySelector('[data-result-path="nodes.out"]')
          ?.getAttribute('title')
          ?.split(' ')[0],
      );
      expect(current).toBeCloseTo((5 - vout) / r1, 12);
    });
    expect(elementRow('R1').textContent).toContain('1 kΩ');

    await user.click(within(form).getByRole('button', { name: 'Cancel' }));
    await waitFor(() => expect(screen.queryByText('Includes unsaved changes to R1.')).toBeNull());
    await waitFor(() => {
      const current = Number(
        document
          .querySelector('[data-result-path="elements.r1.current"]')
          ?.getAttribute('title')
          ?.split(' ')[0],
      );
      const vout = Number(
        document
          .querySelector('[data-result-path="nodes.out"]')
          ?.getAttribute('title')
          ?.split(' ')[0],
      );
      expect(current).toBeCloseTo((5 - vout) / 1000, 12);
    });
  });
});

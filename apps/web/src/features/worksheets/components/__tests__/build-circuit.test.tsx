import { screen, waitFor, within } from '@testing-library/react';
import { solveOperatingPoint, type CircuitInput } from '@biasproof/calc';
import { describe, expect, it } from 'vitest';
import {
  circuitPanel,
  elementRow,
  expectResult,
  fill,
  queryElementRow,
  renderWorksheet,
  resultText,
  startPart,
  submit,
  valueOf,
} from '@/features/worksheets/components/__tests__/worksheet-test-kit.tsx';

describe('building a circuit through the forms', () => {
  it('when the author adds a source, a resistor and a diode, then the bias table shows the engine’s numbers', async () => {
    const { user } = renderWorksheet();
    await user.click(screen.getByRole('button', { name: 'Clear circuit' }));
    expect(await screen.findByText('Nothing to solve yet.')).toBeDefined();

    let form = await startPart(user, 'Voltage source (V)');
    expect(valueOf(within(form).getByLabelText('Name'))).toBe('V1');
    await fill(user, form, { '+ node': 'in', '− node': '0', 'DC voltage (V)': '5' });
    await submit(user, form, 'Add to circuit');
    expect(elementRow('V1').textContent).toContain('5 V DC');

    form = await startPart(user, 'Resistor (R)');
    await fill(user, form, { 'First node': 'in', 'Second node': 'out', 'Resistance (Ω)': '4k7' });
    await submit(user, form, 'Add to circuit');
    expect(elementRow('R1').textContent).toContain('4.7 kΩ');

    form = await startPart(user, 'Diode (D)');
    await fill(user, form, { 'Anode node': 'out', 'Cathode node': '0' });
    await user.click(within(form).getByRole('button', { name: 'New model' }));
    const modelForm = within(circuitPanel()).getByRole('group', { name: /New model/ });
    await fill(user, modelForm, {
      'Model name': 'DQUICK',
      'Parameter 1 value': '1e-14',
      'Parameter 2 value': '1.8',
    });
    await user.click(within(modelForm).getByRole('button', { name: 'Add model' }));
    await waitFor(() => expect(valueOf(within(form).getByLabelText('Model'))).toBe('DQUICK'));
    await submit(user, form, 'Add to circuit');
    expect(elementRow('D1').textContent).toContain('DQUICK');

    const circuit: CircuitInput = {
      elements: [
        { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 5 },
        { kind: 'R', name: 'R1', nodes: ['in', 'out'], value: 4700 },
        { kind: 'D', name: 'D1', nodes: ['out', '0'], model: 'DQUICK' },
      ],
      models: [{ name: 'DQUICK', kind: 'D', params: { IS: 1e-14, N: 1.8 } }],
    };
    const engine = solveOperatingPoint(circuit);
    await expectResult('nodes.out', engine.nodes.out!, 'V');
    await expectResult('nodes.in', 5, 'V');
    const d1 = engine.devices.d1!;
    if (d1.kind !== 'D') throw new Error('d1 is a diode');
    await expectResult('devices.d1.id', d1.id, 'A');
    await expectResult('devices.d1.rd', d1.rd, 'Ω');
    await expectResult('sources.v1', engine.sources.v1!, 'A');
    await expectResult('supplyPower', engine.supplyPower, 'W');
    expect(resultText('devices.d1.region')).toBe('forward');
    expect(resultText('method')).toBe('Newton-Raphson');
    expect(resultText('iterations')).toBe(String(engine.iterations));
  });

  it('when a value is mistyped, then the field says why at once and nothing changes', async () => {
    const { user } = renderWorksheet();
    const before = solveOperatingPoint({
      elements: [
        { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 5 },
        { kind: 'R', name: 'R1', nodes: ['in', 'out'], value: 1000 },
        { kind: 'D', name: 'D1', nodes: ['out', '0'], model: 'DSIG' },
      ],
      models: [{ name: 'DSIG', kind: 'D', params: { IS: 1e-14, N: 1 } }],
    });
    await expectResult('nodes.out', before.nodes.out!, 'V');

    await user.click(within(elementRow('R1')).getByRole('button', { name: 'Edit R1' }));
    const form = within(circuitPanel()).getByRole('region', { name: 'Edit R1' });
    const field = within(form).getByLabelText('Resistance (Ω)');
    await user.clear(field);
    await user.type(field, '4x7');
    expect(
      await within(form).findByText("'4x7' is not a value in Ω: unexpected 'x7' after the number"),
    ).toBeDefined();
    expect(field.getAttribute('aria-invalid')).toBe('true');

    await user.click(within(form).getByRole('button', { name: 'Save changes' }));
    expect(within(circuitPanel()).getByRole('region', { name: 'Edit R1' })).toBeDefined();
    expect(elementRow('R1').textContent).toContain('1 kΩ');

    await user.keyboard('{Escape}');
    expect(within(circuitPanel()).queryByRole('region', { name: 'Edit R1' })).toBeNull();
    expect(elementRow('R1').textContent).toContain('1 kΩ');
    await expectResult('nodes.out', before.nodes.out!, 'V');
  });

  it('when a part makes the circuit unsolvable, then the error names it and its row is marked', async () => {
    const { user } = renderWorksheet();
    const form = await startPart(user, 'Voltage source (V)');
    expect(valueOf(within(form).getByLabelText('Name'))).toBe('V2');
    await fill(user, form, { '+ node': 'in', '− node': '0', 'DC voltage (V)': '3' });
    await submit(user, form, 'Add to circuit');

    const notice = (await screen.findByText('The circuit cannot be solved')).closest<HTMLElement>(
      '[role="alert"]',
    )!;
    expect(notice.textContent).toContain('The circuit cannot be solved');
    expect(notice.textContent).toMatch(/Element: V2/);
    expect(notice.textContent).toMatch(/v2 closes a loop of voltage sources/);
    expect(within(elementRow('V2')).getByText('engine error')).toBeDefined();
    expect(within(elementRow('V1')).queryByText('engine error')).toBeNull();

    await user.click(within(notice).getByRole('button', { name: 'Go to V2' }));
    expect(document.activeElement).toBe(
      within(elementRow('V2')).getByRole('button', { name: 'Edit V2' }),
    );

    await user.click(within(elementRow('V2')).getByRole('button', { name: 'Delete V2' }));
    expect(queryElementRow('V2')).toBeNull();
    await waitFor(() => expect(screen.queryByText('The circuit cannot be solved')).toBeNull());
  });
});

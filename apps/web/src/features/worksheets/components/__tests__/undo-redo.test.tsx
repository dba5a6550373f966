import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { formatValue } from '@biasproof/calc';
import { describe, expect, it } from 'vitest';
import {
  elementRow,
  expectResult,
  fill,
  queryElementRow,
  renderWorksheet,
  startPart,
  submit,
} from '@/features/worksheets/components/__tests__/worksheet-test-kit.tsx';

const ctrl = (key: string, shiftKey = false) =>
  fireEvent.keyDown(document.body, { key, ctrlKey: true, shiftKey });

describe('undo and redo', () => {
  it('when the author deletes, adds and edits parts, then the buttons and Ctrl+Z / Ctrl+Shift+Z / Ctrl+Y walk the edits back and forth', async () => {
    const { user } = renderWorksheet();
    const undo = screen.getByRole('button', { name: 'Undo' });
    const redo = screen.getByRole('button', { name: 'Redo' });
    expect(undo).toHaveProperty('disabled', true);

    await user.click(within(elementRow('D1')).getByRole('button', { name: 'Delete D1' }));
    expect(queryElementRow('D1')).toBeNull();
    expect(undo.getAttribute('title')).toBe('Undo: delete D1 (Ctrl+Z)');

    const form = await startPart(user, 'Resistor (R)');
    await fill(user, form, { 'First node': 'out', 'Second node': '0', 'Resistance (Ω)': '1k' });
    await submit(user, form, 'Add to circuit');
    expect(elementRow('R2').textContent).toContain('1 kΩ');
    await expectResult('nodes.out', 2.5, 'V');

    await user.click(undo);
    expect(queryElementRow('R2')).toBeNull();
    ctrl('z');
    expect(elementRow('D1')).toBeDefined();
    expect(undo).toHaveProperty('disabled', true);

    ctrl('z', true);
    expect(queryElementRow('D1')).toBeNull();
    ctrl('y');
    expect(elementRow('R2')).toBeDefined();
    await expectResult('nodes.out', 2.5, 'V');
    expect(redo).toHaveProperty('disabled', true);

    await user.click(undo);
    await user.click(redo);
    expect(elementRow('R2')).toBeDefined();
  });

  it('when a settings field is typed into, then one undo takes back the whole run of keystrokes', async () => {
    const { user } = renderWorksheet();
    const temperature = screen.getByLabelText('Temperature (°C)');
    await user.clear(temperature);
    await user.type(temperature, '85');
    await waitFor(() =>
      expect(document.querySelector('[data-result-path="temperature"]')?.textContent).toBe(
        formatValue(85, '°C'),
      ),
    );

    // Ctrl+Z inside a text field belongs to the field; the button undoes the worksheet edit.
    await user.click(screen.getByRole('button', { name: 'Undo' }));
    expect(temperature).toHaveProperty('value', '27');
    await waitFor(() =>
      expect(document.querySelector('[data-result-path="temperature"]')?.textContent).toBe(
        formatValue(27, '°C'),
      ),
    );
    expect(screen.getByRole('button', { name: 'Undo' })).toHaveProperty('disabled', true);
  });
});

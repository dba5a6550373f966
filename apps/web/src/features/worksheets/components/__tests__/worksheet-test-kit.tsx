import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { formatValue, type WorksheetDraft } from '@biasproof/calc';
import { expect, vi } from 'vitest';
import { computeInPage } from '@/features/worksheets/compute/compute-function.ts';
import { WorksheetComputeProvider } from '@/features/worksheets/compute/compute-context.tsx';
import { ScratchWorksheetPage } from '@/features/worksheets/components/scratch-worksheet-page.tsx';

/** Helpers the worksheet tests share: render the page, walk the forms, read result paths. */

// Each flow types into real forms and runs the engine on every edit (on the test's thread):
// seconds, not milliseconds, when the machine is busy.
vi.setConfig({ testTimeout: 30_000 });

export type User = ReturnType<typeof userEvent.setup>;

export function renderWorksheet(initialDraft?: () => WorksheetDraft) {
  const user = userEvent.setup();
  render(
    <WorksheetComputeProvider compute={computeInPage}>
      {initialDraft ? (
        <ScratchWorksheetPage initialDraft={initialDraft} />
      ) : (
        <ScratchWorksheetPage />
      )}
    </WorksheetComputeProvider>,
  );
  return { user };
}

/** The text shown for a result path, e.g. `nodes.out`. */
export function resultText(path: string): string | null {
  return document.querySelector(`[data-result-path="${path}"]`)?.textContent ?? null;
}

/** Waits until the result at `path` shows `value` formatted as the page formats it. */
export async function expectResult(path: string, value: number, unit: string) {
  await waitFor(() => expect(resultText(path)).toBe(formatValue(value, unit)));
}

export function circuitPanel(): HTMLElement {
  return screen.getByRole('region', { name: 'Circuit' });
}

/** The element's row in the editor's table. */
export function elementRow(name: string): HTMLElement {
  return within(circuitPanel()).getByRole('row', { name: new RegExp(`^${name}\\b`) });
}

export function queryElementRow(name: string): HTMLElement | null {
  return within(circuitPanel()).queryByRole('row', { name: new RegExp(`^${name}\\b`) });
}

export function valueOf(element: HTMLElement): string {
  return (element as HTMLInputElement | HTMLSelectElement).value;
}

/** Opens the form for a new part of the given kind (as the select names it). */
export async function startPart(user: User, kindOption: string): Promise<HTMLElement> {
  const panel = circuitPanel();
  await user.selectOptions(within(panel).getByLabelText('Kind of part'), kindOption);
  await user.click(within(panel).getByRole('button', { name: 'Add part' }));
  return within(panel).getByRole('region', { name: /^New / });
}

/** Fills labelled fields of a form (clearing what is there first). */
export async function fill(user: User, form: HTMLElement, fields: Record<string, string>) {
  for (const [label, value] of Object.entries(fields)) {
    const input = within(form).getByLabelText(label);
    await user.clear(input);
    if (value !== '') await user.type(input, value);
  }
}

/** Clicks the form's submit button and waits for the form to close (its row is then in the table). */
export async function submit(user: User, form: HTMLElement, button: string) {
  await user.click(within(form).getByRole('button', { name: button }));
  await waitFor(() => expect(form.isConnected).toBe(false));
}

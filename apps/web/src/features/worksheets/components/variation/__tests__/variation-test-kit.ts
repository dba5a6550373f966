import { screen, within } from '@testing-library/react';
import {
  analysisSettingsSchema,
  worksheetVariationSchema,
  type WorksheetDraft,
  type WorksheetVariationInput,
} from '@biasproof/calc';
import type { User } from '@/features/worksheets/components/__tests__/worksheet-test-kit.tsx';

/** A 10 V supply across two 10 kΩ resistors: Vout = V·R2/(R1 + R2) = 5 V (divider formula). */
export function divider(variation?: WorksheetVariationInput, r1 = 10_000): WorksheetDraft {
  return {
    circuit: {
      title: 'Reference divider',
      elements: [
        { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 10 },
        { kind: 'R', name: 'R1', nodes: ['in', 'out'], value: r1 },
        { kind: 'R', name: 'R2', nodes: ['out', '0'], value: 10_000 },
      ],
      models: [],
    },
    settings: analysisSettingsSchema.parse({
      inputSource: 'V1',
      outputNode: 'out',
      ...(variation ? { variation: worksheetVariationSchema.parse(variation) } : {}),
    }),
  };
}

/** R1 and R2 at ±1 % (normal, 3σ), following V(out). */
export const onePercent: WorksheetVariationInput = {
  parameters: [
    { target: 'R1', tolerancePercent: 1 },
    { target: 'R2', tolerancePercent: 1 },
  ],
  probes: ['nodes.out'],
};

export function resultsPanel(): HTMLElement {
  return screen.getByRole('region', { name: 'Results' });
}

export async function openView(user: User, name: 'Variation' | 'Limits and checks') {
  await user.click(await within(resultsPanel()).findByRole('tab', { name }, { timeout: 10_000 }));
  return within(resultsPanel()).getByRole('tabpanel');
}

/** The exact number behind a shown result (its title holds it). */
export function rawResult(path: string): number | null {
  const title = document.querySelector(`[data-result-path="${path}"]`)?.getAttribute('title');
  const value = title ? Number(title.split(' ')[0]) : NaN;
  return Number.isFinite(value) ? value : null;
}

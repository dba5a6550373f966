import type { WorksheetState } from '@biasproof/shared';
import { Chip, type ChipTone } from '@/components/ui/chip.tsx';

const stateLabels: Record<WorksheetState, string> = {
  draft: 'Draft',
  in_check: 'In check',
  checked: 'Checked',
  signed_off: 'Signed off',
  returned: 'Returned',
  withdrawn: 'Withdrawn',
  superseded: 'Superseded',
};

const stateTones: Record<WorksheetState, ChipTone> = {
  draft: 'accent',
  in_check: 'pending',
  checked: 'pending',
  signed_off: 'ok',
  returned: 'fault',
  withdrawn: 'neutral',
  superseded: 'neutral',
};

export function stateLabel(state: WorksheetState): string {
  return stateLabels[state];
}

/** The workflow state of a worksheet as a coloured chip. */
export function StateChip({ state }: { state: WorksheetState }) {
  return <Chip tone={stateTones[state]}>{stateLabels[state]}</Chip>;
}

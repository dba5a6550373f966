import type { ComponentType, ReactNode } from 'react';
import type { Worksheet } from '@biasproof/shared';

/**
 * What the saved-worksheet page offers to whatever the app plugs into it (the review workflow,
 * later other views): the worksheet as last saved and a way to start the page afresh. The
 * worksheets feature knows nothing of review; the app layer composes the two (see README).
 */
export interface WorksheetSlotContext {
  /** The worksheet as last read or saved; its `version` is the one a workflow step must send. */
  worksheet: Worksheet;
  /** Edits wait to be saved: a step taken now would act on an older version. */
  unsavedEdits: boolean;
  /** Reads the worksheet again and starts the page afresh from it (after a workflow step). */
  reload: () => Promise<void>;
}

export interface WorksheetSlots {
  /** Under the page heading: workflow actions, signatures, links. */
  actionBar?: ReactNode;
  /** Beside the results. */
  sidePanel?: ReactNode;
  /** Result paths that carry a marker (e.g. findings), with the words the marker stands for. */
  numberAnnotations?: ReadonlyMap<string, string>;
  /** When set, every number with a result path can be activated (click, Enter, Space). */
  onNumberActivate?: (path: string) => void;
}

/**
 * Plugged into the page: reads the context (it may use hooks and render dialogs of its own)
 * and hands the page its slots through `children`.
 */
export type WorksheetSlotsComponent = ComponentType<{
  context: WorksheetSlotContext;
  children: (slots: WorksheetSlots) => ReactNode;
}>;

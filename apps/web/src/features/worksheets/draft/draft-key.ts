import type { WorksheetDraft } from '@biasproof/calc';
import { canonicalJson } from '@biasproof/shared';

/**
 * One text per draft content (canonical JSON, as the revision hash uses): two drafts with the
 * same key hold the same circuit and settings, whatever their objects' identity or key order.
 */
export function draftKey(draft: WorksheetDraft): string {
  return canonicalJson({ circuit: draft.circuit, settings: draft.settings });
}

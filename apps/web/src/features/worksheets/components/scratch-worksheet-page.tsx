import { WorksheetWorkspace } from '@/features/worksheets/components/worksheet-workspace.tsx';
import type { WorksheetDraft } from '@biasproof/calc';
import { starterDraft } from '@/features/worksheets/draft/starter-draft.ts';

/**
 * A worksheet that lives only in this browser tab: for trying a circuit before the worksheet
 * exists on the server. Opens with an example diode bias network.
 */
export function ScratchWorksheetPage({
  initialDraft = starterDraft,
}: {
  initialDraft?: () => WorksheetDraft;
}) {
  return (
    <>
      <title>Scratch worksheet · Biasproof</title>
      <WorksheetWorkspace
        initialDraft={initialDraft}
        heading={(draft) => (
          <div>
            <p className="text-sm font-semibold text-ink-600">
              Scratch worksheet · kept in this tab only
            </p>
            <h1 className="text-3xl font-bold text-ink-900">
              {draft.circuit.title.trim() || 'Untitled block'}
            </h1>
          </div>
        )}
      />
    </>
  );
}

import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { subject, type Finding, type Worksheet } from '@biasproof/shared';
import { TextLink } from '@/components/ui/text-link.tsx';
import { useFindings } from '@/features/review/api/list-findings.ts';
import { worksheetReviewKey } from '@/features/review/api/review-key.ts';
import { ActionBar } from '@/features/review/components/action-bar.tsx';
import { RaiseFindingDialog } from '@/features/review/components/raise-finding-dialog.tsx';
import { CurrentRecordDownloads } from '@/features/review/components/record-downloads.tsx';
import { ReviewPanel } from '@/features/review/components/review-panel.tsx';
import { Reviewers, type Assignable } from '@/features/review/components/reviewers.tsx';
import { RevisionSignatures } from '@/features/review/components/revision-signatures.tsx';
import { WatchToggle } from '@/features/review/components/watch-toggle.tsx';
import { staleNotice } from '@/features/review/components/workflow-copy.ts';
import { useStepNotice } from '@/features/review/hooks/use-step-notice.ts';
import { resultNumberAt, statusLabels } from '@/features/review/components/review-format.ts';
import { useAppAbility } from '@/lib/ability.tsx';
import { orgPath, useCurrentOrg } from '@/lib/current-org.tsx';
import { useOrganization } from '@/lib/api/get-organization.ts';

/** What the worksheet page tells the review (the shape of its slot context). */
export interface ReviewContext {
  worksheet: Worksheet;
  unsavedEdits: boolean;
  reload: () => Promise<void>;
}

/** What the review hands the worksheet page (the shape of its slots). */
export interface ReviewSlotsOutput {
  actionBar?: ReactNode;
  sidePanel?: ReactNode;
  numberAnnotations?: ReadonlyMap<string, string>;
  onNumberActivate?: (path: string) => void;
}

/** States in which a checker may raise findings (the server answers 409 otherwise). */
const reviewStates = new Set(['in_check', 'checked']);

/** "2 findings: 1 open, 1 answered" per path, for the markers on the numbers. */
function annotate(findings: readonly Finding[]): Map<string, string> {
  const byPath = new Map<string, Finding[]>();
  for (const f of findings) byPath.set(f.path, [...(byPath.get(f.path) ?? []), f]);
  const words = new Map<string, string>();
  for (const [path, list] of byPath) {
    const counts = (['open', 'answered', 'closed'] as const)
      .map((s) => [s, list.filter((f) => f.status === s).length] as const)
      .filter(([, n]) => n > 0)
      .map(([s, n]) => `${n} ${statusLabels[s].toLowerCase()}`);
    words.set(
      path,
      `${list.length} ${list.length === 1 ? 'finding' : 'findings'}: ${counts.join(', ')}`,
    );
  }
  return words;
}

/** The number as the results show it now, to remind the checker which one they picked. */
function shownValueOf(path: string): string | null {
  const text = resultNumberAt(path)?.textContent?.trim();
  return text ? text : null;
}

/**
 * The review plugged into the worksheet page: the action bar and signatures under the heading,
 * the findings and files beside the results, markers on numbers with findings, and (for a
 * checker while the revision is in review) any number opens the form to raise a finding on it.
 */
export function ReviewSlots({
  context,
  children,
  onStep,
  people = [],
}: {
  context: ReviewContext;
  children: (slots: ReviewSlotsOutput) => ReactNode;
  /** Told after every workflow step, e.g. to refresh lists elsewhere in the app. */
  onStep?: () => Promise<unknown>;
  /** The organization's members, offered as checker and approver. */
  people?: readonly Assignable[];
}) {
  const { worksheet, unsavedEdits, reload } = context;
  const { membership, user } = useCurrentOrg();
  const orgId = membership.orgId;
  const ability = useAppAbility();
  const timeZone = useOrganization(orgId).data?.timezone ?? 'UTC';
  const findings = useFindings(orgId, worksheet.id);
  const [raising, setRaising] = useState<{ path: string; shown: string | null } | null>(null);

  const mayRaise =
    reviewStates.has(worksheet.state) &&
    ability.can('create', subject('Finding', { worksheetAuthorId: worksheet.author.id }));
  const annotations = useMemo(() => annotate(findings.data?.items ?? []), [findings.data]);
  const activate = useCallback(
    (path: string) => setRaising({ path, shown: shownValueOf(path) }),
    [],
  );
  const afterStep = useCallback(async () => {
    await Promise.all([reload(), onStep?.()]);
  }, [reload, onStep]);
  const [, setNotice] = useStepNotice(orgId, worksheet.id);

  // Each save of the author's edits is a new version: the findings' current values (and a new
  // revision's carried findings) follow it.
  const queryClient = useQueryClient();
  const seenVersion = useRef(worksheet.version);
  useEffect(() => {
    if (seenVersion.current === worksheet.version) return;
    seenVersion.current = worksheet.version;
    void queryClient.invalidateQueries({ queryKey: worksheetReviewKey(orgId, worksheet.id) });
  }, [queryClient, orgId, worksheet.id, worksheet.version]);

  const actionBar = (
    <div className="flex flex-col gap-3">
      <RevisionSignatures
        orgId={orgId}
        worksheetId={worksheet.id}
        revision={worksheet.revision}
        timeZone={timeZone}
      />
      <Reviewers
        orgId={orgId}
        worksheet={worksheet}
        people={people}
        onChanged={() => {
          setNotice({ tone: 'ok', text: 'The checker and approver are saved.' });
          void afterStep();
        }}
        onStale={(message) => {
          setNotice({ tone: 'fault', text: staleNotice(message) });
          void afterStep();
        }}
      />
      <div className="flex flex-wrap items-start justify-between gap-3">
        <ActionBar
          orgId={orgId}
          worksheet={worksheet}
          roles={membership.roles}
          userId={user.id}
          printedName={user.name}
          username={user.email}
          timeZone={timeZone}
          unsavedEdits={unsavedEdits}
          onStep={afterStep}
        />
        <TextLink to={orgPath(membership.orgSlug, `worksheets/${worksheet.id}/history`)}>
          History and differences
        </TextLink>
      </div>
      <div className="flex flex-wrap items-start justify-between gap-3">
        <CurrentRecordDownloads
          orgId={orgId}
          worksheetId={worksheet.id}
          letter={worksheet.revision}
        />
        <WatchToggle orgId={orgId} worksheetId={worksheet.id} userId={user.id} />
      </div>
    </div>
  );

  return (
    <>
      {children({
        actionBar,
        sidePanel: (
          <ReviewPanel
            orgId={orgId}
            worksheet={worksheet}
            timeZone={timeZone}
            onNewFinding={mayRaise ? () => setRaising({ path: '', shown: null }) : undefined}
          />
        ),
        numberAnnotations: annotations,
        ...(mayRaise ? { onNumberActivate: activate } : {}),
      })}
      {raising ? (
        <RaiseFindingDialog
          orgId={orgId}
          worksheetId={worksheet.id}
          revision={worksheet.revision}
          path={raising.path}
          shownValue={raising.shown}
          onClose={() => setRaising(null)}
        />
      ) : null}
    </>
  );
}

import { subject, type Finding, type Worksheet } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { Card } from '@/components/ui/card.tsx';
import { EmptyState } from '@/components/ui/empty-state.tsx';
import { ErrorMessage, LoadingMessage } from '@/components/ui/message.tsx';
import { useAttachments } from '@/features/review/api/list-attachments.ts';
import { useFindings } from '@/features/review/api/list-findings.ts';
import { AttachmentList } from '@/features/review/components/attachment-list.tsx';
import { AttachmentUpload } from '@/features/review/components/attachment-upload.tsx';
import type { ThreadRights } from '@/features/review/components/finding-composer.tsx';
import { FindingItem } from '@/features/review/components/finding-item.tsx';
import { useAppAbility } from '@/lib/ability.tsx';

export interface ReviewPanelProps {
  orgId: string;
  worksheet: Worksheet;
  timeZone: string;
  /** Set when the person may raise a finding now (opens the form with an empty path). */
  onNewFinding?: (() => void) | undefined;
}

/** The review beside the results: findings with their threads, and the worksheet's files. */
export function ReviewPanel({ orgId, worksheet, timeZone, onNewFinding }: ReviewPanelProps) {
  const ability = useAppAbility();
  const findings = useFindings(orgId, worksheet.id);
  const attachments = useAttachments(orgId, worksheet.id);
  const findingSubject = subject('Finding', { worksheetAuthorId: worksheet.author.id });
  const mayAttach = ability.can(
    'create',
    subject('Attachment', { worksheetAuthorId: worksheet.author.id }),
  );

  const rightsOf = (f: Finding): ThreadRights => ({
    answer: f.status === 'open' && ability.can('answer', findingSubject),
    close: f.status !== 'closed' && ability.can('close', findingSubject),
    reopen: f.status !== 'open' && ability.can('close', findingSubject),
    reply: ability.can('reply', findingSubject),
  });
  const filesOf = (findingId: string | null) =>
    (attachments.data?.items ?? []).filter((a) => a.findingId === findingId);

  const items = findings.data?.items ?? [];
  const active = items.filter((f) => f.status !== 'closed');
  const closed = items.filter((f) => f.status === 'closed');
  const item = (f: Finding) => (
    <li key={f.id}>
      <FindingItem
        orgId={orgId}
        worksheetId={worksheet.id}
        finding={f}
        currentRevision={worksheet.revision}
        rights={rightsOf(f)}
        attachments={filesOf(f.id)}
        mayAttach={mayAttach}
        timeZone={timeZone}
      />
    </li>
  );

  return (
    <Card aria-labelledby="review-panel-title" className="flex flex-col gap-4 !p-5">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="review-panel-title" className="text-lg font-bold text-ink-900">
          Review
        </h2>
        {onNewFinding ? (
          <Button size="sm" variant="outline" onClick={onNewFinding}>
            New finding
          </Button>
        ) : null}
      </div>
      {onNewFinding ? (
        <p className="text-sm text-ink-600">
          Click any number in the results (or focus it and press Enter) to pin a finding to it.
        </p>
      ) : null}

      <section aria-labelledby="findings-title" className="flex flex-col gap-3">
        <h3 id="findings-title" className="font-semibold text-ink-900">
          Findings{' '}
          {findings.data ? (
            <span className="font-normal text-ink-600">
              ({active.length} not closed, {closed.length} closed)
            </span>
          ) : null}
        </h3>
        {findings.isPending ? <LoadingMessage>Loading the findings…</LoadingMessage> : null}
        {findings.isError ? (
          <ErrorMessage>The findings could not be loaded: {findings.error.message}</ErrorMessage>
        ) : null}
        {findings.data && items.length === 0 ? (
          <EmptyState title="No findings yet.">
            A checker pins findings to the numbers of a submitted revision.
          </EmptyState>
        ) : null}
        {active.length > 0 ? <ul className="flex flex-col gap-3">{active.map(item)}</ul> : null}
        {closed.length > 0 ? (
          <details className="rounded-md border border-rule px-3 py-2">
            <summary className="cursor-pointer text-sm font-semibold text-ink-700">
              Closed findings ({closed.length})
            </summary>
            <ul className="mt-2 flex flex-col gap-3">{closed.map(item)}</ul>
          </details>
        ) : null}
      </section>

      <section
        aria-labelledby="files-title"
        className="flex flex-col gap-2 border-t border-rule pt-3"
      >
        <h3 id="files-title" className="font-semibold text-ink-900">
          Files of the worksheet
        </h3>
        {attachments.isError ? (
          <ErrorMessage>The files could not be loaded: {attachments.error.message}</ErrorMessage>
        ) : null}
        {attachments.data && filesOf(null).length === 0 ? (
          <p className="text-sm text-ink-600">No files attached to the worksheet.</p>
        ) : null}
        <AttachmentList orgId={orgId} items={filesOf(null)} label="Files of the worksheet" />
        {mayAttach ? (
          <AttachmentUpload
            orgId={orgId}
            worksheetId={worksheet.id}
            label="Attach a file to the worksheet"
          />
        ) : null}
      </section>
    </Card>
  );
}

import type { Attachment, Finding } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { Chip, type ChipTone } from '@/components/ui/chip.tsx';
import { AttachmentList } from '@/features/review/components/attachment-list.tsx';
import { AttachmentUpload } from '@/features/review/components/attachment-upload.tsx';
import {
  FindingComposer,
  type ThreadRights,
} from '@/features/review/components/finding-composer.tsx';
import {
  formatPinned,
  replyKindLabels,
  resultNumberAt,
  severityLabels,
  statusLabels,
} from '@/features/review/components/review-format.ts';
import { formatInZone } from '@/lib/org-time.ts';

const severityTones: Record<Finding['severity'], ChipTone> = {
  note: 'neutral',
  minor: 'pending',
  major: 'fault',
};
const statusTones: Record<Finding['status'], ChipTone> = {
  open: 'fault',
  answered: 'pending',
  closed: 'ok',
};

/** Brings the number a finding is pinned to into view, when the results show it. */
function showNumber(path: string) {
  const number = resultNumberAt(path);
  if (!number) return false;
  number.scrollIntoView({ block: 'center' });
  (number.closest('button') ?? number).focus();
  return true;
}

/** One finding: what it says, the number it is pinned to then and now, its thread and files. */
export function FindingItem({
  orgId,
  worksheetId,
  finding,
  currentRevision,
  rights,
  attachments,
  mayAttach,
  timeZone,
}: {
  orgId: string;
  worksheetId: string;
  finding: Finding;
  currentRevision: string;
  rights: ThreadRights;
  attachments: readonly Attachment[];
  mayAttach: boolean;
  timeZone: string;
}) {
  const name = `${severityLabels[finding.severity]} finding, ${statusLabels[finding.status].toLowerCase()}, on ${finding.path}`;
  return (
    <article
      aria-label={name}
      data-finding-path={finding.path}
      className="flex flex-col gap-2 rounded-md border border-rule px-3 py-3"
    >
      <header className="flex flex-wrap items-center gap-2">
        <Chip tone={severityTones[finding.severity]}>{severityLabels[finding.severity]}</Chip>
        <Chip tone={statusTones[finding.status]}>{statusLabels[finding.status]}</Chip>
        <h4 className="font-mono text-sm font-semibold text-ink-900">{finding.path}</h4>
        {finding.carried ? (
          <span className="text-xs text-ink-600">carried from revision {finding.revision}</span>
        ) : null}
      </header>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
        <dt className="text-ink-600">Pinned (rev. {finding.revision})</dt>
        <dd className="tabular-nums">{formatPinned(finding.pinnedValue, finding.path)}</dd>
        {finding.revision !== currentRevision ? (
          <>
            <dt className="text-ink-600">Now (rev. {currentRevision})</dt>
            <dd className="tabular-nums">
              {formatPinned(finding.currentValue, finding.path)}
              {finding.valueChanged ? (
                <strong className="ml-2 rounded-sm border border-pending bg-pending-tint px-1 text-xs font-bold text-pending">
                  <span aria-hidden="true">Δ </span>Number changed
                </strong>
              ) : null}
            </dd>
          </>
        ) : null}
      </dl>
      <p className="whitespace-pre-wrap text-sm text-ink-900">{finding.text}</p>
      <p className="text-xs text-ink-600">
        Raised by {finding.createdBy.name}, {formatInZone(finding.createdAt, timeZone)}
      </p>
      {finding.replies.length > 0 ? (
        <ol aria-label="Thread" className="flex flex-col gap-2 border-l-2 border-rule pl-3">
          {finding.replies.map((r) => (
            <li key={r.id} className="text-sm">
              <p className="text-xs text-ink-600">
                <strong className="font-semibold text-ink-700">{replyKindLabels[r.kind]}</strong> by{' '}
                {r.by.name}, {formatInZone(r.at, timeZone)}
              </p>
              {r.text ? <p className="whitespace-pre-wrap text-ink-900">{r.text}</p> : null}
            </li>
          ))}
        </ol>
      ) : null}
      <AttachmentList
        orgId={orgId}
        items={attachments}
        label={`Files of the finding on ${finding.path}`}
      />
      <div className="flex flex-wrap gap-2">
        <Button size="sm" variant="quiet" onClick={() => showNumber(finding.path)}>
          Show in results
        </Button>
      </div>
      <FindingComposer orgId={orgId} worksheetId={worksheetId} finding={finding} rights={rights} />
      {mayAttach ? (
        <AttachmentUpload
          orgId={orgId}
          worksheetId={worksheetId}
          findingId={finding.id}
          label={`Attach a file to the finding on ${finding.path}`}
        />
      ) : null}
    </article>
  );
}

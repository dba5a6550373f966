import type { Attachment } from '@biasproof/shared';
import { attachmentDownloadUrl } from '@/features/review/api/list-attachments.ts';
import { fileSize } from '@/features/review/components/review-format.ts';

const typeLabels: Record<Attachment['type'], string> = {
  pdf: 'PDF',
  png: 'PNG image',
  jpeg: 'JPEG image',
  csv: 'CSV',
  deck: 'SPICE deck',
};

/** Files with download links (the server sends them as attachments, never to be shown inline). */
export function AttachmentList({
  orgId,
  items,
  label,
}: {
  orgId: string;
  items: readonly Attachment[];
  label: string;
}) {
  if (items.length === 0) return null;
  return (
    <ul aria-label={label} className="flex flex-col gap-1 text-sm">
      {items.map((a) => (
        <li key={a.id} className="flex flex-wrap items-baseline gap-x-2">
          <a
            href={attachmentDownloadUrl(orgId, a.id)}
            download={a.filename}
            className="font-semibold text-accent underline underline-offset-4 hover:text-accent-strong focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent"
          >
            {a.filename}
          </a>
          <span className="text-xs text-ink-600">
            {typeLabels[a.type]}, {fileSize(a.size)} · rev. {a.revision} · {a.uploadedBy.name}
          </span>
        </li>
      ))}
    </ul>
  );
}

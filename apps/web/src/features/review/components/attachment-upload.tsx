import { useId, useRef, useState, type ChangeEvent } from 'react';
import { MAX_ATTACHMENT_BYTES } from '@biasproof/shared';
import { ErrorMessage, SuccessMessage } from '@/components/ui/message.tsx';
import { useUploadAttachment } from '@/features/review/api/upload-attachment.ts';
import { fileSize } from '@/features/review/components/review-format.ts';

// A hint for the file picker only: the server decides by the content.
const accept =
  '.pdf,.png,.jpg,.jpeg,.csv,.cir,.sp,.net,.spi,.txt,application/pdf,image/png,image/jpeg,text/csv';

/** Picks a file and uploads it at once (to the worksheet, or to one finding). */
export function AttachmentUpload({
  orgId,
  worksheetId,
  findingId,
  label,
}: {
  orgId: string;
  worksheetId: string;
  findingId?: string;
  label: string;
}) {
  const id = useId();
  const input = useRef<HTMLInputElement>(null);
  const upload = useUploadAttachment(orgId, worksheetId);
  const [busy, setBusy] = useState<string | null>(null);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);

  async function onPick(event: ChangeEvent<HTMLInputElement>) {
    const file = event.target.files?.[0];
    if (!file) return;
    setMessage(null);
    if (file.size > MAX_ATTACHMENT_BYTES) {
      setMessage({
        ok: false,
        text: `${file.name} is ${fileSize(file.size)}; files up to ${fileSize(MAX_ATTACHMENT_BYTES)} are accepted.`,
      });
      if (input.current) input.current.value = '';
      return;
    }
    setBusy(`Uploading ${file.name} (${fileSize(file.size)})…`);
    try {
      const saved = await upload.mutateAsync({ file, findingId });
      setMessage({ ok: true, text: `Attached ${saved.filename}.` });
    } catch (error) {
      setMessage({
        ok: false,
        text: `${file.name} was not attached: ${error instanceof Error ? error.message : 'the upload failed.'}`,
      });
    } finally {
      setBusy(null);
      if (input.current) input.current.value = '';
    }
  }

  return (
    <div className="flex flex-col gap-1 text-sm">
      <label htmlFor={id} className="font-semibold text-ink-700">
        {label}
      </label>
      <input
        ref={input}
        id={id}
        type="file"
        accept={accept}
        disabled={busy !== null}
        aria-describedby={`${id}-hint`}
        onChange={(event) => void onPick(event)}
        className="text-sm file:mr-3 file:rounded-md file:border file:border-ink-500 file:bg-surface file:px-3 file:py-1 file:font-semibold"
      />
      <p id={`${id}-hint`} className="text-xs text-ink-600">
        PDF, PNG, JPEG, CSV or a SPICE deck, up to 20 MB; the type is read from the content.
      </p>
      <p role="status" aria-busy={busy !== null} className="text-xs text-ink-700">
        {busy}
      </p>
      {message?.ok ? <SuccessMessage>{message.text}</SuccessMessage> : null}
      {message && !message.ok ? <ErrorMessage>{message.text}</ErrorMessage> : null}
    </div>
  );
}

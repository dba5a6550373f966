import { ErrorMessage } from '@/components/ui/message.tsx';
import { useSignatures } from '@/features/review/api/list-signatures.ts';
import { SignatureManifest } from '@/features/review/components/signature-manifest.tsx';

/** The signatures of the revision on screen; nothing while it has none. */
export function RevisionSignatures({
  orgId,
  worksheetId,
  revision,
  timeZone,
}: {
  orgId: string;
  worksheetId: string;
  revision: string;
  timeZone: string;
}) {
  const signatures = useSignatures(orgId, worksheetId);
  if (signatures.isError) {
    return (
      <ErrorMessage>The signatures could not be loaded: {signatures.error.message}</ErrorMessage>
    );
  }
  const mine = (signatures.data?.items ?? []).filter((s) => s.revision === revision);
  if (mine.length === 0) return null;
  return (
    <section aria-label={`Signatures of revision ${revision}`} className="flex flex-col gap-2">
      {mine.map((s) => (
        <SignatureManifest key={s.id} signature={s} timeZone={timeZone} />
      ))}
    </section>
  );
}

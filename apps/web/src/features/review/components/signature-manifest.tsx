import type { Signature } from '@biasproof/shared';
import { formatInZone } from '@/lib/org-time.ts';

/**
 * The manifestation of one electronic signature: printed name, meaning, date-time (in the
 * organization's time zone) and the content hash of the revision signed. Shown with every
 * display of a signed revision.
 */
export function SignatureManifest({
  signature,
  timeZone,
}: {
  signature: Signature;
  timeZone: string;
}) {
  return (
    <figure
      aria-label={`Signature of ${signature.printedName}`}
      className="rounded-md border border-ok bg-ok-tint px-3 py-2 text-sm text-ink-900"
    >
      <figcaption className="font-semibold text-ok">
        <span aria-hidden="true">✔ </span>Signed electronically: {signature.meaning}
      </figcaption>
      <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5">
        <dt className="text-ink-600">Signed by</dt>
        <dd className="font-semibold" data-testid="signature-printed-name">
          {signature.printedName}
        </dd>
        <dt className="text-ink-600">Meaning</dt>
        <dd>{signature.meaning}</dd>
        <dt className="text-ink-600">Date and time</dt>
        <dd>
          <time dateTime={signature.signedAt}>{formatInZone(signature.signedAt, timeZone)}</time>
        </dd>
        <dt className="text-ink-600">Revision</dt>
        <dd className="font-mono">{signature.revision}</dd>
        <dt className="text-ink-600">Content hash</dt>
        <dd className="font-mono text-xs break-all">SHA-256 {signature.contentHash}</dd>
      </dl>
      {signature.supersededAt ? (
        <p className="mt-1 font-semibold text-ink-700">
          Superseded {formatInZone(signature.supersededAt, timeZone)}: a later revision was signed.
        </p>
      ) : null}
    </figure>
  );
}

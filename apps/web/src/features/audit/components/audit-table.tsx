import type { AuditEvent } from '@biasproof/shared';
import { TextLink } from '@/components/ui/text-link.tsx';
import { orgPath } from '@/lib/current-org.tsx';
import { formatInZone } from '@/lib/org-time.ts';

/** The manifestation a `worksheet.signed` event carries in its details, when it does. */
function signatureIn(details: Record<string, unknown>) {
  const { printedName, meaning, signedAt, contentHash } = details;
  if (
    typeof printedName !== 'string' ||
    typeof meaning !== 'string' ||
    typeof signedAt !== 'string' ||
    typeof contentHash !== 'string'
  ) {
    return null;
  }
  return { printedName, meaning, signedAt, contentHash };
}

const head = 'px-3 py-2 text-left text-xs font-semibold uppercase tracking-wide text-ink-600';
const cell = 'px-3 py-2 align-top text-sm text-ink-900';

/** The audit events of one page: when, who, what, on which worksheet revision, from where. */
export function AuditTable({
  items,
  orgSlug,
  timeZone,
  worksheetTitle,
}: {
  items: readonly AuditEvent[];
  orgSlug: string;
  timeZone: string;
  /** The title of a worksheet id, when the list of worksheets knows it. */
  worksheetTitle: (id: string) => string | undefined;
}) {
  return (
    <div className="overflow-x-auto rounded-md border border-rule">
      <table className="w-full border-collapse" aria-label="Audit events">
        <thead className="bg-paper">
          <tr>
            <th scope="col" className={head}>
              When
            </th>
            <th scope="col" className={head}>
              Who
            </th>
            <th scope="col" className={head}>
              Action
            </th>
            <th scope="col" className={head}>
              What happened
            </th>
            <th scope="col" className={head}>
              Worksheet
            </th>
            <th scope="col" className={head}>
              From
            </th>
          </tr>
        </thead>
        <tbody>
          {items.map((e) => {
            const signature = signatureIn(e.details);
            return (
              <tr key={e.id} className="border-t border-rule" data-event-id={e.id}>
                <td className={`${cell} whitespace-nowrap tabular-nums`}>
                  <time dateTime={e.at}>{formatInZone(e.at, timeZone)}</time>
                </td>
                <td className={cell}>{e.actor?.name ?? 'System'}</td>
                <td className={`${cell} font-mono text-xs`}>{e.action}</td>
                <th scope="row" className={`${cell} text-left font-normal`}>
                  {e.summary}
                  {signature ? (
                    <span
                      className="mt-1 block text-xs text-ink-700"
                      data-testid="signature-manifest"
                    >
                      Signature: {signature.printedName} · {signature.meaning} ·{' '}
                      {formatInZone(signature.signedAt, timeZone)} · SHA-256{' '}
                      <span className="font-mono break-all">{signature.contentHash}</span>
                    </span>
                  ) : null}
                </th>
                <td className={cell}>
                  {e.worksheetId ? (
                    <TextLink to={orgPath(orgSlug, `worksheets/${e.worksheetId}`)}>
                      {worksheetTitle(e.worksheetId) ?? 'Open worksheet'}
                      {e.revision ? ` (rev. ${e.revision})` : ''}
                    </TextLink>
                  ) : (
                    '—'
                  )}
                </td>
                <td className={`${cell} text-xs text-ink-600`} title={e.userAgent ?? undefined}>
                  {e.ip ?? '—'}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

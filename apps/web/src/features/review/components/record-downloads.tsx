import { recordPackageUrl, reportPdfUrl } from '@/features/review/api/record-urls.ts';
import { useSignatures } from '@/features/review/api/list-signatures.ts';

const linkClasses =
  'inline-flex items-center rounded-md border border-ink-500 bg-surface px-2.5 py-1 text-sm font-semibold text-ink-900 hover:bg-paper focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent';

/**
 * The records of one revision as files: its report and its record package. The letter is in
 * each link's words, since the history lists several revisions' links on one page; an unsigned
 * revision's report says so before it is opened (the PDF is marked NOT SIGNED on every page).
 */
export function RecordDownloads({
  orgId,
  worksheetId,
  letter,
  signed,
}: {
  orgId: string;
  worksheetId: string;
  letter: string;
  /** The revision has at least one signature (superseded ones still count: it was signed). */
  signed: boolean;
}) {
  return (
    <ul aria-label={`Records of revision ${letter}`} className="flex flex-wrap items-center gap-2">
      <li>
        {/* `download` without a name: the server's Content-Disposition names the file. */}
        <a href={reportPdfUrl(orgId, worksheetId, letter)} download className={linkClasses}>
          Download report, revision {letter} (PDF{signed ? '' : ', not signed'})
        </a>
      </li>
      <li>
        <a href={recordPackageUrl(orgId, worksheetId, letter)} download className={linkClasses}>
          Download record package, revision {letter} (zip)
        </a>
      </li>
    </ul>
  );
}

/** The worksheet page's links: the revision on screen, signed once any signature names it. */
export function CurrentRecordDownloads({
  orgId,
  worksheetId,
  letter,
}: {
  orgId: string;
  worksheetId: string;
  letter: string;
}) {
  const signatures = useSignatures(orgId, worksheetId);
  // Until the signatures are known, a report link could only guess whether it is signed.
  if (!signatures.data) return null;
  const signed = signatures.data.items.some((s) => s.revision === letter);
  return (
    <RecordDownloads orgId={orgId} worksheetId={worksheetId} letter={letter} signed={signed} />
  );
}

import { createContext, useContext, useMemo, type ReactNode } from 'react';
import { useParams } from 'react-router-dom';
import {
  resultsCsvUrl,
  type StoredResultsTable,
} from '@/features/worksheets/api/results-csv-url.ts';
import { useCurrentOrg } from '@/lib/current-org.tsx';

interface StoredRevision {
  orgId: string;
  worksheetId: string;
  letter: string;
}

/** Set only while the numbers on screen are a revision's stored ones (not a local preview). */
const StoredRevisionContext = createContext<StoredRevision | null>(null);

/**
 * Marks the results below as the stored results of revision `letter` of the worksheet page
 * (`worksheets/:worksheetId`), so that their tables offer the server's CSV of that revision.
 */
export function StoredCsvProvider({ letter, children }: { letter: string; children: ReactNode }) {
  const { orgId } = useCurrentOrg().membership;
  const { worksheetId } = useParams();
  const value = useMemo(
    () => (worksheetId ? { orgId, worksheetId, letter } : null),
    [orgId, worksheetId, letter],
  );
  return <StoredRevisionContext value={value}>{children}</StoredRevisionContext>;
}

const tableWords: Record<StoredResultsTable, string> = {
  bias: 'bias point (node voltages, element currents and powers, supply power)',
  devices: 'diodes and transistors (operating point and small-signal parameters)',
  'small-signal': 'gain and impedances',
  sweep: 'frequency sweep, every point',
};

const linkClasses =
  'inline-flex items-center rounded-md px-2.5 py-1 text-sm font-semibold text-accent underline underline-offset-4 hover:bg-accent-tint focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent';

/**
 * "Download CSV": the server's table of the stored revision, at full precision in SI units.
 * Nothing for a local preview, whose numbers the server has never seen.
 */
export function StoredCsvLink({ table }: { table: StoredResultsTable }) {
  const stored = useContext(StoredRevisionContext);
  if (!stored) return null;
  const { orgId, worksheetId, letter } = stored;
  return (
    <a
      href={resultsCsvUrl(orgId, worksheetId, letter, table)}
      download
      aria-label={`Download CSV of the stored ${tableWords[table]}, revision ${letter}`}
      className={linkClasses}
    >
      Download CSV
    </a>
  );
}

import { createContext, useContext, type ReactNode } from 'react';
import { useParams } from 'react-router-dom';
import {
  resultsCsvUrl,
  type StoredResultsTable,
} from '@/features/worksheets/api/results-csv-url.ts';
import { useCurrentOrg } from '@/lib/current-org.tsx';

/** The revision letter while the numbers on screen are its stored ones; null for a local preview. */
const StoredLetterContext = createContext<string | null>(null);

/**
 * Says whose stored results the tables below show, so that they offer the server's CSV of that
 * revision. Always rendered (null for a preview): switching between the two must not remount
 * the views and lose what is being typed in them.
 */
export function StoredCsvProvider({
  letter,
  children,
}: {
  letter: string | null;
  children: ReactNode;
}) {
  return <StoredLetterContext value={letter}>{children}</StoredLetterContext>;
}

const tableWords: Record<StoredResultsTable, string> = {
  bias: 'bias point (node voltages, element currents and powers, supply power)',
  devices: 'diodes and transistors (operating point and small-signal parameters)',
  'small-signal': 'gain and impedances',
  sweep: 'frequency sweep, every point',
};

const linkClasses =
  'inline-flex items-center rounded-md px-2.5 py-1 text-sm font-semibold text-accent underline underline-offset-4 hover:bg-accent-tint focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent';

/** Only ever under the saved worksheet's page (`worksheets/:worksheetId`), the one with stored results. */
function StoredCsvAnchor({ letter, table }: { letter: string; table: StoredResultsTable }) {
  const { orgId } = useCurrentOrg().membership;
  const { worksheetId } = useParams();
  if (!worksheetId) return null;
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

/**
 * "Download CSV": the server's table of the stored revision, at full precision in SI units.
 * Nothing for a local preview, whose numbers the server has never seen.
 */
export function StoredCsvLink({ table }: { table: StoredResultsTable }) {
  const letter = useContext(StoredLetterContext);
  return letter ? <StoredCsvAnchor letter={letter} table={table} /> : null;
}

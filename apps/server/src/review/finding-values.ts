import { QueryTypes } from 'sequelize';
import {
  revisionValues,
  samePathValue,
  valueAtPath,
  type Finding,
  type PathValue,
  type RevisionValues,
} from '@biasproof/shared';
import type { OrgTx } from '../orgs/org-scope.ts';

/** Numbers closer than this (relative) are the same number: float noise of a recomputation. */
const SAME_NUMBER = 1e-12;

type PinnedValue = Finding['pinnedValue'];
export type FindingValues = Pick<
  Finding,
  'carried' | 'pinnedValue' | 'currentValue' | 'valueChanged'
>;

/** Finite numbers as numbers, anything else as text (pinnedValueSchema); absent as null. */
const asPinned = (v: PathValue | undefined): PinnedValue =>
  v === undefined || v === null ? null : typeof v === 'boolean' ? String(v) : v;

/**
 * What the findings of one worksheet pin, read from the revisions they were raised on and from
 * the current one, each revision read and flattened once.
 */
export async function findingValuesReader(
  tx: OrgTx,
  worksheetId: string,
  currentLetter: string,
  letters: readonly string[],
): Promise<(finding: Pick<Finding, 'revision' | 'path' | 'status'>) => FindingValues> {
  const wanted = [...new Set([...letters, currentLetter])];
  const rows = await tx.sequelize.query<{
    letter: string;
    circuit: unknown;
    settings: unknown;
    results: unknown;
  }>(
    `SELECT letter, circuit, settings, results FROM revisions
      WHERE org_id = $1 AND worksheet_id = $2 AND letter = ANY ($3::text[])`,
    {
      bind: [tx.orgId, worksheetId, wanted],
      transaction: tx.transaction,
      type: QueryTypes.SELECT,
    },
  );
  const byLetter = new Map<string, RevisionValues>(rows.map((r) => [r.letter, revisionValues(r)]));
  const at = (letter: string, path: string) => {
    const values = byLetter.get(letter);
    return values ? valueAtPath(values, path) : undefined;
  };
  return (finding) => {
    const pinnedValue = asPinned(at(finding.revision, finding.path));
    const currentValue = asPinned(at(currentLetter, finding.path));
    return {
      carried: finding.revision !== currentLetter && finding.status !== 'closed',
      pinnedValue,
      currentValue,
      valueChanged: !samePathValue(pinnedValue, currentValue, SAME_NUMBER),
    };
  };
}

import type { z } from 'zod';
import {
  diffRevisions,
  type revisionDetailSchema,
  type revisionDiffQuerySchema,
  type RevisionDiff,
  type RevisionHistory,
  type Signature,
} from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { OrgContext, OrgTx } from '../orgs/org-scope.ts';
import { readRevision } from '../worksheets/repository.ts';
import { revisionBody } from '../worksheets/worksheets.ts';
import { assertWorksheetExists } from './findings.ts';
import { listSignatures } from './signature-repository.ts';
import { listRevisionSummaries } from './revision-repository.ts';

const iso = (d: Date | string) => new Date(d).toISOString();

export const noSuchRevision = (letter?: string) =>
  new AppError(
    'not-found',
    letter ? `This worksheet has no revision ${letter}.` : 'No such revision of this worksheet.',
  );

function signaturesByLetter(signatures: Signature[]): Map<string, Signature[]> {
  const by = new Map<string, Signature[]>();
  for (const s of signatures) by.set(s.revision, [...(by.get(s.revision) ?? []), s]);
  return by;
}

/** `GET …/worksheets/:id/revisions`: every revision with its state, who/when and signatures, oldest first. */
export async function getRevisionHistory(
  org: OrgContext,
  worksheetId: string,
): Promise<RevisionHistory> {
  return org.read(async (tx) => {
    await assertWorksheetExists(tx, worksheetId);
    const rows = await listRevisionSummaries(tx, worksheetId);
    const signatures = signaturesByLetter(await listSignatures(tx, worksheetId));
    const items = rows.map((r) => ({
      letter: r.letter,
      state: r.state,
      contentHash: r.content_hash,
      frozen: r.frozen,
      engineVersion: r.engine_version,
      createdAt: iso(r.created_at),
      createdBy: { id: r.created_by_user_id, name: r.created_by_name },
      submittedAt: r.submitted_at ? iso(r.submitted_at) : null,
      signatures: signatures.get(r.letter) ?? [],
      findingCount: Number(r.finding_count),
    }));
    return { items, total: items.length };
  });
}

async function revisionOr404(tx: OrgTx, worksheetId: string, letter: string) {
  const revision = await readRevision(tx, worksheetId, letter);
  if (!revision) throw noSuchRevision(letter);
  return revision;
}

/** `GET …/worksheets/:id/revisions/:letter`: one revision in full, with its state and signatures. */
export async function getRevisionDetail(
  org: OrgContext,
  worksheetId: string,
  letter: string,
): Promise<z.input<typeof revisionDetailSchema>> {
  return org.read(async (tx) => {
    await assertWorksheetExists(tx, worksheetId);
    const revision = await revisionOr404(tx, worksheetId, letter);
    const signatures = signaturesByLetter(await listSignatures(tx, worksheetId));
    return {
      ...revisionBody(revision),
      state: revision.state,
      signatures: signatures.get(letter) ?? [],
    };
  });
}

/** `GET …/worksheets/:id/diff?from=A&to=B`: inputs and results that differ, number by number. */
export async function getRevisionDiff(
  org: OrgContext,
  worksheetId: string,
  query: z.output<typeof revisionDiffQuerySchema>,
): Promise<RevisionDiff> {
  return org.read(async (tx) => {
    await assertWorksheetExists(tx, worksheetId);
    const from = await revisionOr404(tx, worksheetId, query.from);
    const to = await revisionOr404(tx, worksheetId, query.to);
    return diffRevisions(from, to);
  });
}

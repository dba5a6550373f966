import {
  exportDeck,
  isEngineError,
  type WorksheetDraft,
  type WorksheetResults,
} from '@biasproof/calc';
import {
  decodeResults,
  type EncodedResults,
  type Finding,
  type PersonRef,
  type Signature,
  type WorksheetListItem,
  type WorksheetState,
} from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { OrgTx } from '../orgs/org-scope.ts';
import { readRevision, readWorksheetItem } from '../worksheets/repository.ts';
import { storedDraft } from '../worksheets/draft-change.ts';
import { listFindings, listSignatures } from '../review/repository.ts';
import {
  listRevisionRows,
  listWorksheetAuditRows,
  readRecordOrganization,
  type RecordOrganization,
} from './repository.ts';

/** What a finding in a record shows: the thread as stored, without the live comparison fields. */
export type RecordFinding = Pick<
  Finding,
  | 'id'
  | 'revision'
  | 'path'
  | 'severity'
  | 'text'
  | 'status'
  | 'createdBy'
  | 'createdAt'
  | 'updatedAt'
  | 'replies'
>;

export interface RecordHistoryEntry {
  letter: string;
  state: WorksheetState;
  contentHash: string;
  frozen: boolean;
  engineVersion: string;
  createdAt: string;
  createdBy: PersonRef;
  signatures: Signature[];
  findingCount: number;
}

export interface RecordAuditEvent {
  seq: number;
  at: string;
  actor: string | null;
  action: string;
  targetType: string;
  details: Record<string, unknown>;
}

/** Everything a record of one revision holds: the report, the package and the CSV files read only this. */
export interface RecordData {
  org: RecordOrganization;
  worksheet: WorksheetListItem;
  revision: {
    letter: string;
    state: WorksheetState;
    isCurrent: boolean;
    draft: WorksheetDraft;
    results: WorksheetResults;
    /** The results exactly as stored (non-finite numbers as strings). */
    storedResults: EncodedResults;
    engineVersion: string;
    contentHash: string;
    frozen: boolean;
    createdAt: string;
    createdBy: PersonRef;
  };
  /** The SPICE deck of the revision, or why it cannot be written. */
  deck: { text: string } | { error: string };
  /** This revision's signatures, oldest first. */
  signatures: Signature[];
  /** Findings raised on this revision or an earlier one, oldest first, each with its thread. */
  findings: RecordFinding[];
  /** Every revision of the worksheet, oldest first. */
  history: RecordHistoryEntry[];
  /** The worksheet's audit events until a later revision was started. */
  auditEvents: RecordAuditEvent[];
}

export const noSuchRevision = () =>
  new AppError('not-found', 'No such worksheet revision in this organization');

/** Revision letters in order: A…Z, then AA… */
export function compareLetters(a: string, b: string): number {
  if (a.length !== b.length) return a.length - b.length;
  return a < b ? -1 : a > b ? 1 : 0;
}

const iso = (d: Date | string) => new Date(d).toISOString();

/**
 * Where a revision ended: the current one shares the worksheet's state; an earlier one is
 * signed off (superseded once a later revision was signed), else it was returned.
 */
function revisionState(
  letter: string,
  worksheet: WorksheetListItem,
  signatures: Signature[],
): WorksheetState {
  if (letter === worksheet.revision) return worksheet.state;
  const own = signatures.filter((s) => s.revision === letter);
  if (own.length === 0) return 'returned';
  return own.every((s) => s.supersededAt) ? 'superseded' : 'signed_off';
}

function deckOf(draft: WorksheetDraft): RecordData['deck'] {
  try {
    const { circuit, settings } = draft;
    // The same directives as the worksheet's deck download (worksheets/deck.ts).
    return {
      text: exportDeck(circuit, {
        op: true,
        temperature: settings.temperature,
        ac: settings.sweep,
      }),
    };
  } catch (e) {
    if (!isEngineError(e)) throw e;
    return { error: `The circuit cannot be written as a deck: ${e.message}` };
  }
}

/** Reads one revision's record inside the caller's organization transaction; 404 when it does not exist. */
export async function loadRecord(
  tx: OrgTx,
  worksheetId: string,
  letter: string,
): Promise<RecordData> {
  const worksheet = await readWorksheetItem(tx, worksheetId);
  const row = worksheet ? await readRevision(tx, worksheetId, letter) : null;
  const org = await readRecordOrganization(tx);
  if (!worksheet || !row || !org) throw noSuchRevision();

  const allSignatures = await listSignatures(tx, worksheetId);
  const allFindings: RecordFinding[] = await listFindings(tx, worksheetId);
  const revisionRows = (await listRevisionRows(tx, worksheetId)).sort((a, b) =>
    compareLetters(a.letter, b.letter),
  );
  const next = revisionRows.find((r) => compareLetters(r.letter, letter) > 0);
  const auditRows = await listWorksheetAuditRows(
    tx,
    worksheetId,
    next ? new Date(next.created_at) : null,
  );

  const draft = storedDraft(row);
  return {
    org,
    worksheet,
    revision: {
      letter,
      state: revisionState(letter, worksheet, allSignatures),
      isCurrent: letter === worksheet.revision,
      draft,
      results: decodeResults(row.results),
      storedResults: row.results,
      engineVersion: row.engine_version,
      contentHash: row.content_hash,
      frozen: row.frozen,
      createdAt: iso(row.created_at),
      createdBy: { id: row.created_by_user_id, name: row.created_by_name },
    },
    deck: deckOf(draft),
    signatures: allSignatures.filter((s) => s.revision === letter),
    findings: allFindings.filter((f) => compareLetters(f.revision, letter) <= 0),
    history: revisionRows.map((r) => ({
      letter: r.letter,
      state: revisionState(r.letter, worksheet, allSignatures),
      contentHash: r.content_hash,
      frozen: r.frozen,
      engineVersion: r.engine_version,
      createdAt: iso(r.created_at),
      createdBy: { id: r.created_by_user_id, name: r.created_by_name },
      signatures: allSignatures.filter((s) => s.revision === r.letter),
      findingCount: allFindings.filter((f) => f.revision === r.letter).length,
    })),
    auditEvents: auditRows.map((e) => ({
      seq: Number(e.seq),
      at: iso(e.at),
      actor: e.actor_name,
      action: e.action,
      targetType: e.target_type,
      details: e.details,
    })),
  };
}

/** A revision once signed stays a signed record, even after a later revision supersedes it. */
export function isSigned(data: RecordData): boolean {
  return data.signatures.length > 0;
}

/** The record's own moment: its last signature, else when the revision was created. */
export function recordMoment(data: RecordData): Date {
  const times = [data.revision.createdAt, ...data.signatures.map((s) => s.signedAt)];
  return new Date(Math.max(...times.map((t) => Date.parse(t))));
}

import { editableWorksheetStates, subject } from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { OrgContext, OrgTx } from '../orgs/org-scope.ts';
import type { WorksheetRow } from '../db/models/worksheet.ts';
import type { RevisionRow } from '../db/models/revision.ts';
import { findCurrentRevisionForUpdate, findWorksheet, insertRevision } from './repository.ts';
import { noSuchWorksheet } from './worksheets.ts';

// The checks every change to a worksheet passes, in this order: it exists in the
// organization (404), the rules let the caller act on it (403), the caller saw its latest
// version (409 stale-version), and its current revision may still change (409 conflict).

/** The worksheet, locked until the transaction ends so concurrent saves queue up. */
export async function lockWorksheet(tx: OrgTx, id: string): Promise<WorksheetRow> {
  const worksheet = await findWorksheet(tx, id, { lock: true });
  if (!worksheet) throw noSuchWorksheet();
  return worksheet;
}

const asSubject = (w: WorksheetRow) => subject('Worksheet', { authorId: w.authorUserId });

export function assertMayEdit(org: OrgContext, worksheet: WorksheetRow): void {
  if (!org.ability.can('update', asSubject(worksheet))) {
    throw new AppError('forbidden', 'Only the author of this worksheet may change it.');
  }
}

/** Assigning the checker and approver: the `assign` right (managers) or being the author. */
export function assertMayAssign(org: OrgContext, worksheet: WorksheetRow): void {
  const subj = asSubject(worksheet);
  if (!org.ability.can('assign', subj) && !org.ability.can('update', subj)) {
    throw new AppError(
      'forbidden',
      'Only a manager or the author may assign the checker and approver of this worksheet.',
    );
  }
}

/** 409 `stale-version` with the current version in `fields.version` (docs/api.md). */
export function assertVersion(worksheet: WorksheetRow, version: number | undefined): void {
  if (version === undefined || version === worksheet.version) return;
  throw new AppError(
    'stale-version',
    `This worksheet was saved by someone else since you read version ${version}; it is now at ` +
      `version ${worksheet.version}. Reload it, or send your changes again with that version.`,
    { version: String(worksheet.version) },
  );
}

/** The letter after `letter`: A → B, Z → AA, AZ → BA. */
export function nextRevisionLetter(letter: string): string {
  const digits = [...letter].map((c) => c.charCodeAt(0) - 64);
  let i = digits.length - 1;
  while (i >= 0 && digits[i] === 26) digits[i--] = 1;
  if (i < 0) digits.unshift(1);
  else digits[i] = (digits[i] ?? 0) + 1;
  return digits.map((d) => String.fromCharCode(64 + d)).join('');
}

/**
 * The current revision, locked, when the author may still change it: draft or returned, not
 * frozen. With `startNextBy`, a returned worksheet whose revision was frozen at submission
 * gets the next revision (B, C…): an unfrozen copy, made current, created by that person.
 */
export async function lockEditableRevision(
  tx: OrgTx,
  worksheet: WorksheetRow,
  options: { startNextBy?: string } = {},
): Promise<RevisionRow> {
  if (!editableWorksheetStates.includes(worksheet.state)) {
    throw new AppError(
      'conflict',
      `This worksheet is ${worksheet.state.replace('_', ' ')}; only a draft or a returned worksheet can be changed.`,
    );
  }
  const revision = await findCurrentRevisionForUpdate(tx, worksheet);
  if (!revision) throw noSuchWorksheet();
  if (revision.frozen && worksheet.state === 'returned' && options.startNextBy) {
    return startNextRevision(tx, worksheet, revision, options.startNextBy);
  }
  if (revision.frozen) {
    throw new AppError('conflict', `Revision ${revision.letter} is frozen and cannot be changed.`);
  }
  return revision;
}

/**
 * The next letter as an unfrozen copy of `frozen`, made the worksheet's current revision: after
 * a return (the author's first edit) and when a signed worksheet is revised.
 */
export async function startNextRevision(
  tx: OrgTx,
  worksheet: WorksheetRow,
  frozen: RevisionRow,
  createdByUserId: string,
): Promise<RevisionRow> {
  const letter = nextRevisionLetter(frozen.letter);
  const next = await insertRevision(tx, {
    worksheetId: worksheet.id,
    letter,
    createdByUserId,
    circuit: frozen.circuit,
    settings: frozen.settings,
    results: frozen.results,
    resultStatus: frozen.resultStatus,
    engineVersion: frozen.engineVersion,
    contentHash: frozen.contentHash,
  } as Parameters<typeof insertRevision>[1]);
  await worksheet.update({ currentRevision: letter }, { transaction: tx.transaction });
  return next;
}

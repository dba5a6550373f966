import { QueryTypes } from 'sequelize';
import type { OrgContext, OrgTx } from '../orgs/org-scope.ts';
import type { PasswordHasher } from '../auth/passwords.ts';
import type { RevisionRow } from '../db/models/revision.ts';
import { AppError } from '../errors/app-error.ts';
import { findUserById } from '../auth/repository.ts';
import { insertSignature, listSignatures, signatureMeanings } from './signature-repository.ts';
import { assertWorksheetExists } from './findings.ts';

/** Thrown inside the transition's transaction, so that it rolls back before the refusal is audited. */
export class SignaturePasswordRefused extends Error {
  constructor(readonly revision: string) {
    super('signature password refused');
  }
}

/** Wrong signing passwords one person may enter within the window before signing pauses. */
export const MAX_REFUSED_SIGNATURES = 5;
const REFUSED_SIGNATURE_WINDOW_MINUTES = 15;

/**
 * A session holder could otherwise guess the account's password through the signing dialog
 * without meeting the sign-in lock. The refusals are already audited, so the audit log is the
 * counter: after five within 15 minutes, signing answers 429 before any password is checked.
 */
async function assertSigningAttemptsLeft(tx: OrgTx, signerId: string): Promise<void> {
  const [row] = await tx.sequelize.query<{ refused: string }>(
    `SELECT count(*) AS refused FROM audit_events
      WHERE org_id = $1 AND actor_user_id = $2 AND action = 'worksheet.signature-refused'
        AND at > now() - make_interval(mins => $3)`,
    {
      bind: [tx.orgId, signerId, REFUSED_SIGNATURE_WINDOW_MINUTES],
      transaction: tx.transaction,
      type: QueryTypes.SELECT,
    },
  );
  if (Number(row?.refused ?? 0) >= MAX_REFUSED_SIGNATURES) {
    throw new AppError(
      'too-many-requests',
      `Too many wrong passwords when signing; try again in ${REFUSED_SIGNATURE_WINDOW_MINUTES} minutes. Nothing was signed.`,
    );
  }
}

/**
 * The electronic signature of a `sign` transition: the meaning must be one of the
 * organization's, the password the signer's own; stores the manifestation (printed name,
 * UTC time, meaning) with the revision's content hash and supersedes earlier signatures.
 */
export async function signRevision(
  tx: OrgTx,
  passwords: PasswordHasher,
  s: {
    worksheetId: string;
    revision: RevisionRow;
    signerId: string;
    meaning: string;
    password: string;
  },
): Promise<Record<string, unknown>> {
  const meanings = await signatureMeanings(tx);
  if (!meanings.includes(s.meaning)) {
    throw new AppError('validation-failed', 'Some fields are not valid', {
      meaning: `Choose one of: ${meanings.join(', ')}.`,
    });
  }
  await assertSigningAttemptsLeft(tx, s.signerId);
  const signer = await findUserById(tx, s.signerId);
  if (!signer || !(await passwords.verify(signer.passwordHash, s.password))) {
    throw new SignaturePasswordRefused(s.revision.letter);
  }
  const signedAt = new Date();
  const { id, superseded } = await insertSignature(tx, {
    worksheetId: s.worksheetId,
    revision: s.revision.letter,
    userId: signer.id,
    printedName: signer.name,
    meaning: s.meaning,
    contentHash: s.revision.contentHash,
    signedAt,
  });
  return {
    signatureId: id,
    meaning: s.meaning,
    printedName: signer.name,
    signedAt: signedAt.toISOString(),
    contentHash: s.revision.contentHash,
    ...(superseded.length ? { superseded } : {}),
  };
}

export async function getSignatures(org: OrgContext, worksheetId: string) {
  return org.read(async (tx) => {
    await assertWorksheetExists(tx, worksheetId);
    const items = await listSignatures(tx, worksheetId);
    return { items, total: items.length };
  });
}

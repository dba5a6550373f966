import type { Role } from '@biasproof/shared';
import { AppError, type FieldErrors } from '../errors/app-error.ts';
import type { OrgTx } from '../orgs/org-scope.ts';
import { activeRolesIn } from '../orgs/repository.ts';
import type { WorksheetRow } from '../db/models/worksheet.ts';

export interface Assignment {
  checkerId?: string | null | undefined;
  approverId?: string | null | undefined;
}

async function assigneeProblem(
  tx: OrgTx,
  userId: string,
  role: Extract<Role, 'checker' | 'approver'>,
  authorId: string,
): Promise<string | undefined> {
  const roles = await activeRolesIn(tx, tx.orgId, userId);
  if (!roles?.includes(role)) {
    return `Choose a member of this organization who holds the ${role} role.`;
  }
  if (userId === authorId) {
    return role === 'checker'
      ? 'The author cannot check their own worksheet; choose another checker.'
      : 'The author cannot sign off their own worksheet; choose another approver.';
  }
  return undefined;
}

/**
 * 400 with a message per field unless each newly named person is an active member holding
 * the role, is not the author, and the checker and approver are different people
 * (separation of duties). Null (unassigning) is always accepted.
 */
export async function assertAssignees(
  tx: OrgTx,
  worksheet: WorksheetRow,
  input: Assignment,
): Promise<void> {
  const fields: FieldErrors = {};
  if (input.checkerId) {
    const problem = await assigneeProblem(tx, input.checkerId, 'checker', worksheet.authorUserId);
    if (problem) fields.checkerId = problem;
  }
  if (input.approverId) {
    const problem = await assigneeProblem(tx, input.approverId, 'approver', worksheet.authorUserId);
    if (problem) fields.approverId = problem;
  }
  const checkerId = input.checkerId === undefined ? worksheet.checkerUserId : input.checkerId;
  const approverId = input.approverId === undefined ? worksheet.approverUserId : input.approverId;
  if (checkerId && checkerId === approverId) {
    const field = input.approverId !== undefined ? 'approverId' : 'checkerId';
    fields[field] ??=
      'The checker of a worksheet cannot also sign it off; choose different people.';
  }
  if (Object.keys(fields).length > 0) {
    throw new AppError('validation-failed', 'Some fields are not valid', fields);
  }
}

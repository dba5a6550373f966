import { z } from 'zod';

/** Roles a member holds in one organization; one person may hold several. */
export const roles = ['admin', 'author', 'checker', 'approver', 'manager'] as const;
export const roleSchema = z.enum(roles);
export type Role = (typeof roles)[number];

export const roleListSchema = z
  .array(roleSchema)
  .min(1, 'Choose at least one role.')
  .transform((r) => [...new Set(r)].sort((a, b) => roles.indexOf(a) - roles.indexOf(b)));

/** What each role may do, in words for the UI (the rules themselves are in abilities.ts). */
export const roleDescriptions: Record<Role, string> = {
  admin: 'Manages members, roles, invitations and organization settings',
  author: 'Creates and edits worksheets, answers findings, submits revisions',
  checker: 'Reviews submitted revisions, raises and closes findings, returns or accepts',
  approver: 'Signs off checked revisions, or returns them',
  manager:
    'Reads everything in the organization, the audit log and exports; assigns checkers and approvers',
};

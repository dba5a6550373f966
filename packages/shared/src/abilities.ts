import {
  AbilityBuilder,
  createMongoAbility,
  subject,
  type ForcedSubject,
  type MongoAbility,
} from '@casl/ability';
import type { Role } from './roles.ts';

/**
 * Who may do what, defined once: the server enforces these rules (it is the authority) and
 * the web app reads the same rules to show only the actions a person may take.
 *
 * Subjects carry the fields the conditions look at; the server checks against the stored
 * object (`subject('Member', row)`), the web app against the object it displays.
 */
export type Action =
  | 'manage'
  | 'read'
  | 'create'
  | 'update'
  | 'delete'
  | 'submit'
  | 'check'
  | 'sign'
  | 'assign'
  | 'export'
  | 'answer'
  | 'close'
  | 'reply';

export interface MemberSubject {
  userId: string;
  roles: Role[];
}
export interface RevisionSubject {
  authorId: string;
  checkerId: string | null;
}
export interface WorksheetSubject {
  authorId: string;
}
export interface FindingSubject {
  /** The author of the worksheet the finding is about. */
  worksheetAuthorId: string;
}
export interface AttachmentSubject {
  /** The author of the worksheet the file is (or would be) attached to. */
  worksheetAuthorId: string;
  /** Who uploaded it; absent for a file not yet uploaded. */
  uploadedById?: string;
}

export type SubjectName =
  | 'Organization'
  | 'OrgSettings'
  | 'Member'
  | 'Invitation'
  | 'AuditLog'
  | 'Project'
  | 'Worksheet'
  | 'Revision'
  | 'Finding'
  | 'ModelLibrary'
  | 'Attachment';

type Subjects =
  | SubjectName
  | (MemberSubject & ForcedSubject<'Member'>)
  | (RevisionSubject & ForcedSubject<'Revision'>)
  | (WorksheetSubject & ForcedSubject<'Worksheet'>)
  | (FindingSubject & ForcedSubject<'Finding'>)
  | (AttachmentSubject & ForcedSubject<'Attachment'>);

export type AppAbility = MongoAbility<[Action, Subjects]>;

export interface AbilityInput {
  /** The person acting. */
  userId: string;
  /** Their roles in the organization the request is about (empty: no membership). */
  roles: readonly Role[];
}

/** Builds the ability of one person in one organization. */
export function defineAbilityFor({ userId, roles }: AbilityInput): AppAbility {
  const { can, cannot, build } = new AbilityBuilder<AppAbility>(createMongoAbility);
  if (roles.length === 0) return build();
  const has = (r: Role) => roles.includes(r);

  // Every member sees the organization, its people, projects, worksheets and model library.
  can('read', [
    'Organization',
    'Member',
    'Project',
    'Worksheet',
    'Revision',
    'Finding',
    'ModelLibrary',
  ]);

  if (has('admin')) {
    can(['read', 'create', 'update', 'delete'], 'Invitation');
    can(['update', 'delete'], 'Member');
    can(['read', 'update'], 'OrgSettings');
    can('read', 'AuditLog');
    // Nobody raises their own roles or removes themselves by the admin screens; another admin must.
    cannot(['update', 'delete'], 'Member', { userId });
  }
  if (has('manager')) {
    can('read', 'AuditLog');
    can('export', ['Worksheet', 'Revision', 'AuditLog']);
    can('assign', 'Worksheet');
    can('update', 'Project'); // rename, re-code, archive and restore projects
    can('read', 'OrgSettings');
  }
  if (has('author')) {
    can('create', ['Project', 'Worksheet']);
    can('update', 'Project');
    can(['update', 'submit'], 'Worksheet', { authorId: userId });
    can('manage', 'ModelLibrary');
    can('update', 'Finding'); // answering findings on their own worksheets is checked per object
  }
  if (has('author')) {
    can('answer', 'Finding', { worksheetAuthorId: userId });
    // The author talks back in the threads of their own worksheets' findings.
    can('reply', 'Finding', { worksheetAuthorId: userId });
  }
  if (has('checker')) {
    can('check', 'Revision');
    can(['create', 'update', 'close'], 'Finding');
    // Separation of duties: nobody raises or closes findings on a worksheet they authored.
    cannot(['create', 'close'], 'Finding', { worksheetAuthorId: userId });
  }
  if (has('approver')) {
    can('sign', 'Revision');
  }
  // Reviewers may comment on any finding's thread; a reply moves nothing, so no duty is at stake.
  if (has('checker') || has('approver')) {
    can('reply', 'Finding');
  }
  // Attachments: every member reads them; the people of the review add evidence (authors to
  // their own worksheets), and whoever uploaded a file may remove it while it is not yet record.
  can('read', 'Attachment');
  if (has('author')) can('create', 'Attachment', { worksheetAuthorId: userId });
  if (has('checker') || has('approver')) can('create', 'Attachment');
  if (has('author') || has('checker') || has('approver')) {
    can('delete', 'Attachment', { uploadedById: userId });
  }
  // Separation of duties: nobody checks or signs what they authored; the checker of a revision
  // cannot also sign it.
  cannot('check', 'Revision', { authorId: userId });
  cannot('sign', 'Revision', { authorId: userId });
  cannot('sign', 'Revision', { checkerId: userId });
  return build();
}

export { subject };

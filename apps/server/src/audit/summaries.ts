/** What an event is about, looked up when it is written, for its summary line. */
export interface SummarySubject {
  action: string;
  details: Record<string, unknown>;
  revision: string | null;
  /** The worksheet's title when the event concerns one. */
  worksheetTitle?: string | null;
  /** `CODE "Name"` of the project when the event concerns one. */
  projectLabel?: string | null;
  /** The name of the person the event is about, when its target is a person. */
  personName?: string | null;
}

const text = (v: unknown): string | null => (typeof v === 'string' && v.length > 0 ? v : null);
const list = (v: unknown): string =>
  Array.isArray(v) && v.length > 0 ? v.map(String).join(', ') : 'no role';

function worksheetPhrase(s: SummarySubject): string {
  const title = s.worksheetTitle ? `"${s.worksheetTitle}"` : 'a worksheet';
  return s.revision ? `${title} revision ${s.revision}` : title;
}

type Describe = (s: SummarySubject, d: Record<string, unknown>) => string;

const person = (s: SummarySubject, d: Record<string, unknown>) =>
  s.personName ?? text(d.email) ?? 'a person';
const project = (s: SummarySubject, d: Record<string, unknown>) =>
  s.projectLabel ?? (text(d.name) ? `"${text(d.name)}"` : 'a project');
const finding =
  (verb: string): Describe =>
  (s, d) => {
    const severity = text(d.severity);
    const what = severity ? `the ${severity} finding` : 'the finding';
    return `${verb} ${what} on ${text(d.path) ?? 'a number'} of ${worksheetPhrase(s)}`;
  };

/** One describer per action the server writes; the wording is Biasproof's own. */
const describers: Record<string, Describe> = {
  'organization.created': (_s, d) => `Created the organization "${text(d.name) ?? ''}"`,
  'account.created': (_s, d) => `Created the account ${text(d.email) ?? ''}`.trim(),
  'account.renamed': (_s, d) =>
    `Renamed the account from "${text(d.from) ?? ''}" to "${text(d.to) ?? ''}"`,
  'account.notifications-changed': (_s, d) =>
    d.delivery === 'daily-digest'
      ? `Chose a daily e-mail digest at ${String(d.digestHourUtc).padStart(2, '0')}:00 UTC`
      : 'Chose to receive workflow e-mail immediately',
  'auth.signed-in': () => 'Signed in',
  'auth.signed-out': () => 'Signed out',
  'auth.password-changed': () => 'Changed the password',
  'auth.password-reset-requested': () => 'Asked for a password reset link',
  'auth.password-reset': () => 'Set a new password with a reset link',
  'auth.locked': (_s, d) =>
    d.scope === 'ip'
      ? `Locked address ${text(d.ip) ?? ''} after repeated failed sign-ins`
      : `Locked the account ${text(d.email) ?? ''} after repeated failed sign-ins`,
  'member.added': (s, d) => `Added ${person(s, d)} as ${list(d.roles)}`,
  'member.roles-changed': (s, d) =>
    `Changed the roles of ${person(s, d)} from ${list(d.rolesBefore)} to ${list(d.roles)}`,
  'member.disabled': (s, d) => `Disabled ${person(s, d)}`,
  'member.enabled': (s, d) => `Enabled ${person(s, d)}`,
  'member.removed': (s, d) => `Removed ${person(s, d)} from the organization`,
  'invitation.created': (_s, d) => `Invited ${text(d.email) ?? 'someone'} as ${list(d.roles)}`,
  'invitation.resent': (_s, d) => `Sent the invitation to ${text(d.email) ?? 'someone'} again`,
  'invitation.revoked': (_s, d) => `Revoked the invitation to ${text(d.email) ?? 'someone'}`,
  'invitation.accepted': (_s, d) =>
    `Accepted the invitation to ${text(d.email) ?? 'someone'} as ${list(d.roles)}`,
  'project.created': (s, d) => `Created project ${project(s, d)}`,
  'project.updated': (s, d) => `Edited project ${project(s, d)}`,
  'project.archived': (s, d) => `Archived project ${project(s, d)}`,
  'project.restored': (s, d) => `Restored project ${project(s, d)}`,
  'worksheet.created': (s) => `Created ${worksheetPhrase(s)}`,
  'worksheet.updated': (s, d) =>
    d.startedFrom ? `Started ${worksheetPhrase(s)} after a return` : `Edited ${worksheetPhrase(s)}`,
  'worksheet.assigned': (s) => `Assigned the checker and approver of ${worksheetPhrase(s)}`,
  'worksheet.computed': (s) => `Recomputed ${worksheetPhrase(s)}`,
  'worksheet.deck-imported': (s) => `Imported a SPICE deck into ${worksheetPhrase(s)}`,
  'worksheet.submitted': (s) => `Submitted ${worksheetPhrase(s)} for check`,
  'worksheet.returned': (s) => `Returned ${worksheetPhrase(s)} to its author`,
  'worksheet.accepted': (s) => `Accepted ${worksheetPhrase(s)} after check`,
  'worksheet.signed': (s, d) =>
    `Signed off ${worksheetPhrase(s)}${text(d.meaning) ? ` as "${text(d.meaning)}"` : ''}`,
  'worksheet.withdrawn': (s) => `Withdrew ${worksheetPhrase(s)}`,
  'worksheet.revised': (s) => `Reopened ${worksheetPhrase(s)} for a new revision`,
  'worksheet.signature-refused': (s) =>
    `Refused to sign ${worksheetPhrase(s)}: the password was wrong`,
  'finding.raised': finding('Raised'),
  'finding.answered': finding('Answered'),
  'finding.closed': finding('Closed'),
  'finding.reopened': finding('Reopened'),
  'finding.replied': finding('Replied to'),
  'record.report-downloaded': (s) => `Downloaded the report of ${worksheetPhrase(s)}`,
  'record.package-downloaded': (s) => `Downloaded the record package of ${worksheetPhrase(s)}`,
  'attachment.uploaded': (s, d) =>
    `Attached "${text(d.filename) ?? 'a file'}" to ${worksheetPhrase(s)}`,
  'attachment.downloaded': (s, d) =>
    `Downloaded "${text(d.filename) ?? 'a file'}" of ${worksheetPhrase(s)}`,
  'attachment.deleted': (s, d) =>
    `Removed "${text(d.filename) ?? 'a file'}" from ${worksheetPhrase(s)}`,
  'model.created': (_s, d) => `Added model ${text(d.name) ?? ''} to the library`,
  'model.updated': (_s, d) => `Edited library model ${text(d.name) ?? ''}`,
  'model.deleted': (_s, d) => `Removed model ${text(d.name) ?? ''} from the library`,
  'audit.exported': (_s, d) =>
    `Exported ${typeof d.rows === 'number' ? d.rows : 0} audit events as CSV`,
};

/**
 * The line a person reads for an event, e.g. `Submitted "Mic preamp" revision A for check`,
 * used when the writer gives none. An action without a describer still reads sensibly: its
 * words, and the worksheet it concerns.
 */
export function describeAuditEvent(s: SummarySubject): string {
  const describe = describers[s.action];
  if (describe) return describe(s, s.details);
  const words = s.action.replace(/[.-]/g, ' ');
  const about = s.worksheetTitle ? `: ${worksheetPhrase(s)}` : '';
  return `${words.charAt(0).toUpperCase()}${words.slice(1)}${about}`;
}

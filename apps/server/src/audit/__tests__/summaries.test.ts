import { describe, expect, it } from 'vitest';
import { describeAuditEvent, type SummarySubject } from '../summaries.ts';

const ws = { worksheetTitle: 'Mic preamp', revision: 'A' };

describe('audit summary lines', () => {
  it.each<[Partial<SummarySubject> & { action: string }, string]>([
    [{ action: 'worksheet.submitted', ...ws }, 'Submitted "Mic preamp" revision A for check'],
    [
      { action: 'worksheet.signed', ...ws, details: { meaning: 'Approved for release' } },
      'Signed off "Mic preamp" revision A as "Approved for release"',
    ],
    [
      { action: 'worksheet.updated', ...ws, revision: 'B', details: { startedFrom: 'A' } },
      'Started "Mic preamp" revision B after a return',
    ],
    [
      { action: 'finding.closed', ...ws, details: { severity: 'major', path: 'devices.q1.ic' } },
      'Closed the major finding on devices.q1.ic of "Mic preamp" revision A',
    ],
    [
      {
        action: 'member.roles-changed',
        personName: 'Ned Okoro',
        details: { rolesBefore: ['author'], roles: ['author', 'checker'] },
      },
      'Changed the roles of Ned Okoro from author to author, checker',
    ],
    [
      { action: 'project.archived', projectLabel: 'LNA-3 "Low-noise amp"' },
      'Archived project LNA-3 "Low-noise amp"',
    ],
    [
      { action: 'auth.locked', details: { scope: 'ip', ip: '192.0.2.4' } },
      'Locked address 192.0.2.4 after repeated failed sign-ins',
    ],
    [{ action: 'audit.exported', details: { rows: 12 } }, 'Exported 12 audit events as CSV'],
    // An action nobody described yet still reads as words, with its worksheet.
    [
      { action: 'worksheet.label-printed', ...ws },
      'Worksheet label printed: "Mic preamp" revision A',
    ],
    [{ action: 'org.settings-changed' }, 'Org settings changed'],
  ])('when the event is %j, then it reads %j', (event, line) => {
    expect(describeAuditEvent({ details: {}, revision: null, ...event })).toBe(line);
  });
});

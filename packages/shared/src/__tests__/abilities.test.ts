import { describe, expect, it } from 'vitest';
import { defineAbilityFor, subject } from '../abilities.ts';
import type { Role } from '../roles.ts';

const author: Role[] = ['author'];
const admin: Role[] = ['admin'];

const me = 'u-me';
const other = 'u-other';

describe('ability rules', () => {
  it('a person without a membership may do nothing', () => {
    const a = defineAbilityFor({ userId: me, roles: [] });
    expect(a.can('read', 'Organization')).toBe(false);
    expect(a.can('read', 'Member')).toBe(false);
  });

  it.each([
    ['admin', 'create', 'Invitation', true],
    ['author', 'create', 'Invitation', false],
    ['manager', 'read', 'AuditLog', true],
    ['checker', 'read', 'AuditLog', false],
    ['admin', 'update', 'OrgSettings', true],
    ['manager', 'update', 'OrgSettings', false],
    ['author', 'create', 'Worksheet', true],
    ['checker', 'create', 'Worksheet', false],
  ] as const)('%s may %s %s: %s', (role, action, subjectName, allowed) => {
    expect(defineAbilityFor({ userId: me, roles: [role] }).can(action, subjectName)).toBe(allowed);
  });

  it('an admin changes another member but never their own roles', () => {
    const a = defineAbilityFor({ userId: me, roles: ['admin'] });
    expect(a.can('update', subject('Member', { userId: other, roles: author }))).toBe(true);
    expect(a.can('update', subject('Member', { userId: me, roles: admin }))).toBe(false);
    expect(a.can('delete', subject('Member', { userId: me, roles: admin }))).toBe(false);
  });

  it('separation of duties: no checking or signing of one’s own revision; the checker cannot sign', () => {
    const a = defineAbilityFor({ userId: me, roles: ['author', 'checker', 'approver'] });
    expect(a.can('check', subject('Revision', { authorId: other, checkerId: null }))).toBe(true);
    expect(a.can('check', subject('Revision', { authorId: me, checkerId: null }))).toBe(false);
    expect(a.can('sign', subject('Revision', { authorId: other, checkerId: 'u-third' }))).toBe(
      true,
    );
    expect(a.can('sign', subject('Revision', { authorId: me, checkerId: 'u-third' }))).toBe(false);
    expect(a.can('sign', subject('Revision', { authorId: other, checkerId: me }))).toBe(false);
  });

  it('an author edits only worksheets they authored', () => {
    const a = defineAbilityFor({ userId: me, roles: ['author'] });
    expect(a.can('update', subject('Worksheet', { authorId: me }))).toBe(true);
    expect(a.can('update', subject('Worksheet', { authorId: other }))).toBe(false);
  });

  it('findings: the author answers those on their own worksheets; a checker raises and closes them on others’ only', () => {
    const author = defineAbilityFor({ userId: me, roles: ['author'] });
    const checker = defineAbilityFor({ userId: me, roles: ['checker'] });
    const own = subject('Finding', { worksheetAuthorId: me });
    const theirs = subject('Finding', { worksheetAuthorId: other });
    expect(author.can('answer', own)).toBe(true);
    expect(author.can('answer', theirs)).toBe(false);
    expect(author.can('close', theirs)).toBe(false);
    expect(checker.can('create', theirs)).toBe(true);
    expect(checker.can('close', theirs)).toBe(true);
    expect(checker.can('create', own)).toBe(false);
    expect(checker.can('close', own)).toBe(false);
    expect(checker.can('answer', own)).toBe(false);
  });

  it.each([
    [['author'], 'own', true],
    [['author'], 'theirs', false],
    [['checker'], 'theirs', true],
    [['approver'], 'theirs', true],
    [['manager'], 'theirs', false],
    [['admin'], 'own', false],
  ] as const)('replies: %j on %s worksheet’s finding → %s', (roles, whose, allowed) => {
    const ability = defineAbilityFor({ userId: me, roles });
    const finding = subject('Finding', { worksheetAuthorId: whose === 'own' ? me : other });
    expect(ability.can('reply', finding)).toBe(allowed);
  });
});

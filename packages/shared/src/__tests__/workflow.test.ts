import { describe, expect, it } from 'vitest';
import {
  availableActions,
  decideTransition,
  workflowActions,
  type WorkflowAction,
  type WorkflowWorksheet,
} from '../workflow.ts';
import type { Role } from '../roles.ts';
import type { WorksheetState } from '../api/worksheets.ts';

const ann = 'u-ann'; // author
const kim = 'u-kim'; // checker
const abe = 'u-abe'; // approver
const rolesOf: Record<string, Role[]> = {
  [ann]: ['author'],
  [kim]: ['checker'],
  [abe]: ['approver'],
};

const sheet = (
  state: WorksheetState,
  more: Partial<WorkflowWorksheet> = {},
): WorkflowWorksheet => ({
  state,
  authorId: ann,
  checkerId: kim,
  approverId: abe,
  ...more,
});

describe('workflow state machine', () => {
  it.each([
    ['submit', 'draft', ann, 'in_check'],
    ['submit', 'returned', ann, 'in_check'],
    ['return', 'in_check', kim, 'returned'],
    ['return', 'checked', abe, 'returned'],
    ['accept', 'in_check', kim, 'checked'],
    ['sign', 'checked', abe, 'signed_off'],
    ['withdraw', 'draft', ann, 'withdrawn'],
    ['withdraw', 'in_check', ann, 'withdrawn'],
    ['withdraw', 'checked', ann, 'withdrawn'],
    ['withdraw', 'returned', ann, 'withdrawn'],
    ['revise', 'signed_off', ann, 'draft'],
  ] as const)('when %s from %s by %s, then it leads to %s', (action, from, who, to) => {
    const d = decideTransition(action, sheet(from), { userId: who, roles: rolesOf[who]! }, 0);
    expect(d).toEqual({ action, allowed: true, from, to });
  });

  it.each([
    ['submit', 'in_check', ann],
    ['submit', 'signed_off', ann],
    ['accept', 'draft', kim],
    ['accept', 'checked', kim],
    ['return', 'draft', kim],
    ['return', 'returned', kim],
    ['sign', 'in_check', abe],
    ['sign', 'signed_off', abe],
    ['withdraw', 'signed_off', ann],
    ['withdraw', 'withdrawn', ann],
    ['withdraw', 'superseded', ann],
    ['revise', 'draft', ann],
    ['revise', 'checked', ann],
    ['revise', 'returned', ann],
  ] as const)('when %s from %s, then it is an invalid transition', (action, from, who) => {
    const d = decideTransition(action, sheet(from), { userId: who, roles: rolesOf[who]! }, 0);
    expect(d).toMatchObject({ allowed: false, code: 'invalid-transition' });
  });

  it.each([
    ['submit', 'draft', kim, ['checker'], 'Only the author of this worksheet may do this.'],
    ['submit', 'draft', 'u-bob', ['author'], 'Only the author of this worksheet may do this.'],
    ['withdraw', 'in_check', abe, ['approver'], 'Only the author of this worksheet may do this.'],
    ['accept', 'in_check', ann, ['author'], 'Only a checker may do this.'],
    ['accept', 'in_check', abe, ['approver'], 'Only a checker may do this.'],
    ['accept', 'in_check', 'u-kit', ['checker'], 'Only the assigned checker may do this.'],
    ['return', 'in_check', abe, ['approver'], 'Only a checker may do this.'],
    ['return', 'checked', kim, ['checker'], 'Only an approver may do this.'],
    ['sign', 'checked', kim, ['checker'], 'Only an approver may do this.'],
    ['sign', 'checked', 'u-abby', ['approver'], 'Only the assigned approver may do this.'],
    ['revise', 'signed_off', abe, ['approver'], 'Only the author of this worksheet may do this.'],
    ['revise', 'signed_off', 'u-bob', ['author'], 'Only the author of this worksheet may do this.'],
  ] as const)(
    'when %s from %s by %s (%j), then it is forbidden: %s',
    (action, from, who, roles, reason) => {
      const d = decideTransition(action, sheet(from), { userId: who, roles }, 0);
      expect(d).toEqual({ action, allowed: false, from, code: 'forbidden', reason });
    },
  );

  it('when the author also holds the checker and approver roles, then they can neither check nor sign their own revision', () => {
    const cal: Role[] = ['author', 'checker', 'approver'];
    const own = sheet('in_check', { authorId: 'u-cal', checkerId: 'u-cal', approverId: 'u-cal' });
    const actor = { userId: 'u-cal', roles: cal };
    expect(decideTransition('accept', own, actor, 0)).toMatchObject({
      allowed: false,
      code: 'forbidden',
      reason: 'Nobody checks a revision they authored.',
    });
    expect(decideTransition('sign', { ...own, state: 'checked' }, actor, 0)).toMatchObject({
      allowed: false,
      code: 'forbidden',
      reason: 'Nobody signs off a revision they authored.',
    });
  });

  it('when the checker who accepted a revision is also its approver, then they cannot sign it', () => {
    const both: Role[] = ['checker', 'approver'];
    const d = decideTransition(
      'sign',
      sheet('checked', { approverId: 'u-kip', checkerId: kim, checkedById: 'u-kip' }),
      { userId: 'u-kip', roles: both },
      0,
    );
    expect(d).toMatchObject({
      allowed: false,
      code: 'forbidden',
      reason: 'The checker of a revision cannot also sign it off.',
    });
  });

  it.each([[{ checkerId: null }], [{ approverId: null }], [{ checkerId: null, approverId: null }]])(
    'when %j, then submit is blocked until both are assigned',
    (missing) => {
      const d = decideTransition(
        'submit',
        sheet('draft', missing),
        { userId: ann, roles: ['author'] },
        0,
      );
      expect(d).toMatchObject({ allowed: false, code: 'assignment-missing' });
    },
  );

  it.each([
    [
      'accept',
      'in_check',
      kim,
      1,
      '1 major finding is still open; close them before accepting or signing off.',
    ],
    [
      'sign',
      'checked',
      abe,
      2,
      '2 major findings are still open; close them before accepting or signing off.',
    ],
  ] as const)(
    'when %s with open major findings, then it is blocked',
    (action, from, who, open, reason) => {
      const d = decideTransition(action, sheet(from), { userId: who, roles: rolesOf[who]! }, open);
      expect(d).toEqual({ action, allowed: false, from, code: 'open-findings', reason });
    },
  );

  it('when open major findings exist, then returning is still possible', () => {
    const d = decideTransition('return', sheet('in_check'), { userId: kim, roles: ['checker'] }, 3);
    expect(d.allowed).toBe(true);
  });

  it('when listing available actions, then every action appears once with its verdict', () => {
    const list = availableActions(sheet('in_check'), kim, ['checker'], 0);
    expect(list.map((d) => d.action)).toEqual([...workflowActions]);
    const allowed = list.filter((d) => d.allowed).map((d) => d.action);
    expect(allowed).toEqual<WorkflowAction[]>(['return', 'accept']);
    expect(list.find((d) => d.action === 'sign')).toMatchObject({
      allowed: false,
      code: 'invalid-transition',
    });
  });
});

import { defineAbilityFor, subject } from './abilities.ts';
import type { Role } from './roles.ts';
import type { WorksheetState } from './api/worksheets.ts';

/**
 * The review workflow of a worksheet, as data: which action leads from which states to which
 * state, and the guards that may block it. The server is the authority (it decides with
 * `decideTransition` inside the transaction); the web app calls `availableActions` to show
 * only the buttons a person may press, with the reason when one is blocked.
 */
export const workflowActions = [
  'submit',
  'return',
  'accept',
  'sign',
  'withdraw',
  'revise',
] as const;
export type WorkflowAction = (typeof workflowActions)[number];

/** The worksheet as the guards see it. */
export interface WorkflowWorksheet {
  state: WorksheetState;
  authorId: string;
  /** The assigned checker. */
  checkerId: string | null;
  /** The assigned approver. */
  approverId: string | null;
  /** Who accepted the current revision (its checker for separation of duties), once accepted. */
  checkedById?: string | null;
}

export interface WorkflowActor {
  userId: string;
  roles: readonly Role[];
}

/**
 * Why an action is blocked; the server answers 403 for `forbidden` and 409 for the others:
 * `invalid-transition` (not from this state), `open-findings` (a major finding is open),
 * `assignment-missing` (no checker or approver assigned).
 */
export type BlockCode = 'forbidden' | 'invalid-transition' | 'open-findings' | 'assignment-missing';

export type TransitionDecision =
  | { action: WorkflowAction; allowed: true; from: WorksheetState; to: WorksheetState }
  | {
      action: WorkflowAction;
      allowed: false;
      from: WorksheetState;
      code: BlockCode;
      reason: string;
    };

/** Who acts in each step: the author's actions need `submit`, the checker's `check`, the approver's `sign`. */
type Duty = 'author' | 'checker' | 'approver';

interface Edge {
  from: readonly WorksheetState[];
  to: WorksheetState;
  duty: Duty;
}

/**
 * Every transition; `return` has two edges (the checker from in_check, the approver from
 * checked). `revise` reopens a signed worksheet as the next revision: the signed one stays as
 * it was (signed, later superseded) and the new one starts as a draft.
 */
export const transitions: Record<WorkflowAction, readonly Edge[]> = {
  submit: [{ from: ['draft', 'returned'], to: 'in_check', duty: 'author' }],
  return: [
    { from: ['in_check'], to: 'returned', duty: 'checker' },
    { from: ['checked'], to: 'returned', duty: 'approver' },
  ],
  accept: [{ from: ['in_check'], to: 'checked', duty: 'checker' }],
  sign: [{ from: ['checked'], to: 'signed_off', duty: 'approver' }],
  withdraw: [
    { from: ['draft', 'in_check', 'checked', 'returned'], to: 'withdrawn', duty: 'author' },
  ],
  revise: [{ from: ['signed_off'], to: 'draft', duty: 'author' }],
};

const stateWords = (s: WorksheetState) => s.replace('_', ' ');

function dutyProblem(duty: Duty, w: WorkflowWorksheet, actor: WorkflowActor): string | null {
  const ability = defineAbilityFor(actor);
  const revision = subject('Revision', {
    authorId: w.authorId,
    checkerId: w.checkedById ?? w.checkerId,
  });
  if (duty === 'author') {
    if (!ability.can('submit', subject('Worksheet', { authorId: w.authorId }))) {
      return 'Only the author of this worksheet may do this.';
    }
    return null;
  }
  if (duty === 'checker') {
    if (!actor.roles.includes('checker')) return 'Only a checker may do this.';
    if (!ability.can('check', revision)) return 'Nobody checks a revision they authored.';
    if (w.checkerId !== actor.userId) return 'Only the assigned checker may do this.';
    return null;
  }
  if (!actor.roles.includes('approver')) return 'Only an approver may do this.';
  if (actor.userId === w.authorId) return 'Nobody signs off a revision they authored.';
  if (!ability.can('sign', revision)) return 'The checker of a revision cannot also sign it off.';
  if (w.approverId !== actor.userId) return 'Only the assigned approver may do this.';
  return null;
}

/**
 * Whether `actor` may take `action` on the worksheet now. Guards in order: the state allows
 * the action at all, the actor's role and separation of duties, assignments (submit), open
 * major findings (accept, sign).
 */
export function decideTransition(
  action: WorkflowAction,
  worksheet: WorkflowWorksheet,
  actor: WorkflowActor,
  openMajorFindings: number,
): TransitionDecision {
  const from = worksheet.state;
  const blocked = (code: BlockCode, reason: string): TransitionDecision => ({
    action,
    allowed: false,
    from,
    code,
    reason,
  });
  const edges = transitions[action];
  const edge = edges.find((e) => e.from.includes(from));
  if (!edge) {
    const allowedFrom = [...new Set(edges.flatMap((e) => e.from))].map(stateWords).join(' or ');
    return blocked(
      'invalid-transition',
      `This worksheet is ${stateWords(from)}; ${action} is possible only from ${allowedFrom}.`,
    );
  }
  const problem = dutyProblem(edge.duty, worksheet, actor);
  if (problem) return blocked('forbidden', problem);
  if (action === 'submit' && (!worksheet.checkerId || !worksheet.approverId)) {
    return blocked(
      'assignment-missing',
      'Assign a checker and an approver before submitting this worksheet.',
    );
  }
  if ((action === 'accept' || action === 'sign') && openMajorFindings > 0) {
    return blocked(
      'open-findings',
      `${openMajorFindings} major finding${openMajorFindings === 1 ? ' is' : 's are'} still open; ` +
        'close them before accepting or signing off.',
    );
  }
  return { action, allowed: true, from, to: edge.to };
}

/** Every action with its verdict, for an action bar. */
export function availableActions(
  worksheet: WorkflowWorksheet,
  userId: string,
  roles: readonly Role[],
  openMajorFindings: number,
): TransitionDecision[] {
  return workflowActions.map((action) =>
    decideTransition(action, worksheet, { userId, roles }, openMajorFindings),
  );
}

/** The audit action of a transition, e.g. `worksheet.submitted`. */
export const transitionAuditAction: Record<WorkflowAction, string> = {
  submit: 'worksheet.submitted',
  return: 'worksheet.returned',
  accept: 'worksheet.accepted',
  sign: 'worksheet.signed',
  withdraw: 'worksheet.withdrawn',
  revise: 'worksheet.revised',
};

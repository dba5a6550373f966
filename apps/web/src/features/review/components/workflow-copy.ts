import type { Role, Worksheet } from '@biasproof/shared';

/** How one workflow action reads on its button and in its confirmation. */
export interface ActionCopy {
  label: string;
  /** Title of the confirmation dialog. */
  title: (w: Worksheet) => string;
  /** What happens, said before the person confirms. */
  explain: (w: Worksheet) => string;
  confirmLabel: string;
  /** Said after the step, e.g. "Revision A is in check." */
  done: (w: Worksheet) => string;
  /** The comment is required (the author must learn why), optional, or not asked. */
  comment: 'required' | 'optional' | 'none';
  /** The role whose holder may take it (others never see it, even blocked). */
  role: (from: string) => Role;
  danger?: boolean;
}

const person = (p: { name: string } | null, fallback: string) => p?.name ?? fallback;

// Keyed by action name: a server that offers an action this table lacks still gets a button.
export const actionCopy: Record<string, ActionCopy> = {
  submit: {
    label: 'Submit for check',
    title: (w) => `Submit revision ${w.revision} for check?`,
    explain: (w) =>
      `Revision ${w.revision} is frozen when you submit it: nobody can change it afterwards. ` +
      `${person(w.checker, 'The checker')} is asked to check it.`,
    confirmLabel: 'Submit for check',
    done: (w) => `Revision ${w.revision} was submitted for check.`,
    comment: 'optional',
    role: () => 'author',
  },
  accept: {
    label: 'Accept',
    title: (w) => `Accept revision ${w.revision}?`,
    explain: (w) =>
      `You confirm that you checked revision ${w.revision} and that no major finding is open. ` +
      `${person(w.approver, 'The approver')} is asked to sign it off.`,
    confirmLabel: 'Accept revision',
    done: (w) => `Revision ${w.revision} was accepted.`,
    comment: 'optional',
    role: () => 'checker',
  },
  return: {
    label: 'Return to author',
    title: (w) => `Return revision ${w.revision} to ${w.author.name}?`,
    explain: (w) =>
      `${w.author.name} gets revision ${w.revision} back with its open findings and your comment, ` +
      'and answers them in a new revision.',
    confirmLabel: 'Return to author',
    done: (w) => `Revision ${w.revision} was returned to ${w.author.name}.`,
    comment: 'required',
    role: (from) => (from === 'checked' ? 'approver' : 'checker'),
    danger: true,
  },
  sign: {
    label: 'Sign off…',
    title: (w) => `Sign off revision ${w.revision}`,
    explain: () => '',
    confirmLabel: 'Sign',
    done: (w) => `Revision ${w.revision} is signed off.`,
    comment: 'none',
    role: () => 'approver',
  },
  withdraw: {
    label: 'Withdraw',
    title: (w) => `Withdraw “${w.title}”?`,
    explain: () =>
      'A withdrawn worksheet leaves the review for good: nobody checks or signs it. ' +
      'Say why, for the record.',
    confirmLabel: 'Withdraw worksheet',
    done: () => 'The worksheet was withdrawn.',
    comment: 'required',
    role: () => 'author',
    danger: true,
  },
  revise: {
    label: 'Start a new revision',
    title: (w) => `Start a revision after ${w.revision}?`,
    explain: (w) =>
      `A new revision starts as an editable copy of signed revision ${w.revision}. ` +
      `Revision ${w.revision} and its signature stay as they are until the new one is signed.`,
    confirmLabel: 'Start new revision',
    done: () => 'A new revision was started; you can edit it now.',
    comment: 'optional',
    role: () => 'author',
  },
};

export function copyOf(action: string): ActionCopy {
  return (
    actionCopy[action] ?? {
      label: action.charAt(0).toUpperCase() + action.slice(1),
      title: (w) => `${action} revision ${w.revision}?`,
      explain: () => '',
      confirmLabel: action,
      done: () => `Done: ${action}.`,
      comment: 'optional',
      role: () => 'author',
    }
  );
}

/** Said when a change was refused because the worksheet moved on (409 `stale-version`). */
export function staleNotice(message: string): string {
  return `${message} Someone changed this worksheet after this page read it; it now shows the current version. Check it and try again.`;
}

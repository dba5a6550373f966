import { useId, useState } from 'react';
import type { Role, WorkflowAction, Worksheet } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage, SuccessMessage } from '@/components/ui/message.tsx';
import { useAvailableActions } from '@/features/review/api/get-available-actions.ts';
import { SignOffDialog } from '@/features/review/components/sign-off-dialog.tsx';
import { TransitionDialog } from '@/features/review/components/transition-dialog.tsx';
import { copyOf, staleNotice } from '@/features/review/components/workflow-copy.ts';
import { useStepNotice } from '@/features/review/hooks/use-step-notice.ts';

type Verdict = NonNullable<ReturnType<typeof useAvailableActions>['data']>['items'][number];

/**
 * Which verdicts the person sees: every allowed action; a blocked one only when its holder's
 * role is theirs and the reason is one they can act on or should know (open findings, missing
 * assignment, separation of duties). Steps from other states and other roles' steps stay out.
 */
function shown(verdict: Verdict, roles: readonly Role[], isAuthor: boolean): boolean {
  if (verdict.allowed) return true;
  if (verdict.code === 'invalid-transition') return false;
  const copy = copyOf(verdict.action);
  if (copy.role(verdict.from) === 'author') return isAuthor;
  return roles.includes(copy.role(verdict.from));
}

export interface ActionBarProps {
  orgId: string;
  worksheet: Worksheet;
  roles: readonly Role[];
  userId: string;
  printedName: string;
  /** The person's e-mail (the sign-off form's username). */
  username: string;
  timeZone: string;
  unsavedEdits: boolean;
  /** After a step (or a stale version): start the page afresh from the server. */
  onStep: () => Promise<void>;
}

/** The workflow steps the person may take on this worksheet now, and why others are blocked. */
export function ActionBar({
  orgId,
  worksheet,
  roles,
  userId,
  printedName,
  username,
  timeZone,
  unsavedEdits,
  onStep,
}: ActionBarProps) {
  const id = useId();
  const actions = useAvailableActions(orgId, worksheet.id);
  const [open, setOpen] = useState<WorkflowAction | null>(null);
  const [notice, setNotice] = useStepNotice(orgId, worksheet.id);

  const verdicts = (actions.data?.items ?? []).filter((v) =>
    shown(v, roles, worksheet.author.id === userId),
  );
  const finish = (text: string, tone: 'ok' | 'fault') => {
    setOpen(null);
    setNotice({ tone, text });
    void onStep();
  };
  const outcome = {
    onDone: (next: Worksheet) => finish(copyOf(open ?? '').done(next), 'ok'),
    onStale: (message: string) => finish(staleNotice(message), 'fault'),
    onCancel: () => setOpen(null),
  };

  return (
    <section aria-labelledby={`${id}-title`} className="flex flex-col gap-2">
      <h2 id={`${id}-title`} className="sr-only">
        Workflow
      </h2>
      {notice ? (
        <div className="flex flex-wrap items-start gap-2">
          {notice.tone === 'ok' ? (
            <SuccessMessage>{notice.text}</SuccessMessage>
          ) : (
            <ErrorMessage>{notice.text}</ErrorMessage>
          )}
          <Button size="sm" variant="quiet" onClick={() => setNotice(null)}>
            Dismiss
          </Button>
        </div>
      ) : null}
      {actions.isError ? (
        <ErrorMessage>The workflow steps could not be loaded: {actions.error.message}</ErrorMessage>
      ) : null}
      {actions.data && verdicts.length === 0 ? (
        <p className="text-sm text-ink-600">No workflow step is yours on this worksheet now.</p>
      ) : null}
      {verdicts.length > 0 ? (
        <ul className="flex flex-wrap items-start gap-3" aria-label="Workflow steps">
          {verdicts.map((v) => {
            const copy = copyOf(v.action);
            const reason = v.allowed
              ? unsavedEdits
                ? 'Wait until your edits are saved.'
                : null
              : (v.reason ?? 'Not possible now.');
            const reasonId = `${id}-${v.action}-reason`;
            return (
              <li key={v.action} className="flex max-w-xs flex-col gap-1">
                <Button
                  className="self-start"
                  variant={
                    copy.danger ? 'dangerOutline' : v.action === 'sign' ? 'primary' : 'outline'
                  }
                  disabled={reason !== null}
                  aria-describedby={reason ? reasonId : undefined}
                  onClick={() => {
                    setNotice(null);
                    setOpen(v.action);
                  }}
                >
                  {copy.label}
                </Button>
                {reason ? (
                  <p id={reasonId} className="text-xs text-ink-600">
                    {reason}
                  </p>
                ) : null}
              </li>
            );
          })}
        </ul>
      ) : null}
      {open === 'sign' ? (
        <SignOffDialog
          orgId={orgId}
          worksheet={worksheet}
          meanings={actions.data?.signatureMeanings ?? []}
          printedName={printedName}
          username={username}
          timeZone={timeZone}
          {...outcome}
        />
      ) : open ? (
        <TransitionDialog
          orgId={orgId}
          worksheet={worksheet}
          action={open}
          copy={copyOf(open)}
          {...outcome}
        />
      ) : null}
    </section>
  );
}

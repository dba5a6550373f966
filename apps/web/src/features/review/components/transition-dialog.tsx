import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import {
  transitionRequestSchema,
  type TransitionRequest,
  type WorkflowAction,
  type Worksheet,
} from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { ModalDialog } from '@/components/ui/modal-dialog.tsx';
import { TextAreaField } from '@/components/ui/text-area-field.tsx';
import { useTransitionWorksheet } from '@/features/review/api/transition-worksheet.ts';
import type { ActionCopy } from '@/features/review/components/workflow-copy.ts';
import { ApiError } from '@/lib/api-client.ts';

/** The outcome of a step that the action bar reports. */
export interface StepOutcome {
  onDone: (worksheet: Worksheet) => void;
  /** The version was stale: someone else changed the worksheet first. */
  onStale: (message: string) => void;
  onCancel: () => void;
}

function schemaFor(copy: ActionCopy) {
  return transitionRequestSchema.superRefine((body, ctx) => {
    if (copy.comment === 'required' && !body.comment) {
      ctx.addIssue({ code: 'custom', path: ['comment'], message: 'Say why, in a few words.' });
    }
  });
}

/** Confirms one workflow step (with a comment where it asks one) and sends it with the version. */
export function TransitionDialog({
  orgId,
  worksheet,
  action,
  copy,
  onDone,
  onStale,
  onCancel,
}: StepOutcome & {
  orgId: string;
  worksheet: Worksheet;
  action: WorkflowAction;
  copy: ActionCopy;
}) {
  const transition = useTransitionWorksheet(orgId, worksheet.id);
  const [problem, setProblem] = useState<string | null>(null);
  const schema = schemaFor(copy);
  const {
    register,
    handleSubmit,
    formState: { errors, isSubmitting },
  } = useForm<TransitionRequest, unknown, z.output<typeof schema>>({
    resolver: zodResolver(schema),
    defaultValues: { action, version: worksheet.version, comment: '' },
  });

  async function onValid(body: z.output<typeof schema>) {
    setProblem(null);
    try {
      const next = await transition.mutateAsync({
        action: body.action,
        version: body.version,
        ...(body.comment ? { comment: body.comment } : {}),
      });
      onDone(next);
    } catch (error) {
      if (error instanceof ApiError && error.code === 'stale-version') onStale(error.message);
      else setProblem(error instanceof Error ? error.message : 'The step failed.');
    }
  }

  const formId = `transition-${action}`;
  return (
    <ModalDialog
      role="dialog"
      title={copy.title(worksheet)}
      {...(isSubmitting ? {} : { onDismiss: onCancel })}
      actions={
        <>
          <Button variant="outline" onClick={onCancel} disabled={isSubmitting}>
            Cancel
          </Button>
          <Button
            type="submit"
            form={formId}
            variant={copy.danger ? 'danger' : 'primary'}
            disabled={isSubmitting}
          >
            {isSubmitting ? 'Sending…' : copy.confirmLabel}
          </Button>
        </>
      }
    >
      <p>{copy.explain(worksheet)}</p>
      {problem ? <ErrorMessage>{problem}</ErrorMessage> : null}
      <form
        id={formId}
        noValidate
        onSubmit={(event) => void handleSubmit(onValid)(event)}
        className="flex flex-col gap-3"
      >
        {copy.comment === 'none' ? null : (
          <TextAreaField
            label={copy.comment === 'required' ? 'Comment' : 'Comment (optional)'}
            hint="Recorded in the audit log and sent with the e-mail."
            error={errors.comment?.message}
            data-autofocus
            {...register('comment')}
          />
        )}
      </form>
    </ModalDialog>
  );
}

import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import {
  createFindingRequestSchema,
  findingSeverities,
  type CreateFindingRequest,
} from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { ModalDialog } from '@/components/ui/modal-dialog.tsx';
import { TextAreaField } from '@/components/ui/text-area-field.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import { useRaiseFinding } from '@/features/review/api/raise-finding.ts';
import { severityLabels } from '@/features/review/components/review-format.ts';
import { applyServerErrors } from '@/lib/form-errors.ts';

type FindingBody = z.output<typeof createFindingRequestSchema>;

const severityHints: Record<(typeof findingSeverities)[number], string> = {
  note: 'for the record; blocks nothing',
  minor: 'to fix, blocks nothing',
  major: 'blocks accepting and signing while open',
};

/** The checker pins a finding to a number (path prefilled when a number was clicked). */
export function RaiseFindingDialog({
  orgId,
  worksheetId,
  revision,
  path,
  shownValue,
  onClose,
}: {
  orgId: string;
  worksheetId: string;
  revision: string;
  path: string;
  /** The number as the results show it, when the finding starts from one. */
  shownValue: string | null;
  onClose: () => void;
}) {
  const raise = useRaiseFinding(orgId, worksheetId);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<CreateFindingRequest, unknown, FindingBody>({
    resolver: zodResolver(createFindingRequestSchema),
    defaultValues: { path, severity: 'minor', text: '' },
  });

  async function onValid(body: FindingBody) {
    setProblem(null);
    try {
      await raise.mutateAsync(body);
      onClose();
    } catch (error) {
      setProblem(applyServerErrors(error, setError, ['path', 'severity', 'text']));
    }
  }

  return (
    <ModalDialog
      role="dialog"
      title={`Raise a finding on revision ${revision}`}
      {...(isSubmitting ? {} : { onDismiss: onClose })}
      actions={
        <>
          <Button variant="outline" onClick={onClose} disabled={isSubmitting}>
            Cancel
          </Button>
          <Button type="submit" form="raise-finding-form" disabled={isSubmitting}>
            {isSubmitting ? 'Raising…' : 'Raise finding'}
          </Button>
        </>
      }
    >
      {problem ? <ErrorMessage>{problem}</ErrorMessage> : null}
      <form
        id="raise-finding-form"
        noValidate
        onSubmit={(event) => void handleSubmit(onValid)(event)}
        className="flex flex-col gap-3"
      >
        <TextField
          label="Number or input (path)"
          hint={
            shownValue
              ? `Shown in the results as ${shownValue}.`
              : 'A result path such as devices.q1.ic, or an input such as elements.r2.value.'
          }
          autoComplete="off"
          spellCheck={false}
          error={errors.path?.message}
          {...(path ? {} : { 'data-autofocus': true })}
          {...register('path')}
        />
        <fieldset className="flex flex-col gap-1">
          <legend className="text-sm font-semibold text-ink-700">Severity</legend>
          {findingSeverities.map((s) => (
            <label key={s} className="flex items-center gap-2 text-sm text-ink-900">
              <input type="radio" value={s} {...register('severity')} />
              <span>
                <strong className="font-semibold">{severityLabels[s]}</strong>: {severityHints[s]}
              </span>
            </label>
          ))}
          {errors.severity?.message ? (
            <p className="text-sm font-semibold text-fault">{errors.severity.message}</p>
          ) : null}
        </fieldset>
        <TextAreaField
          label="What is wrong"
          rows={4}
          error={errors.text?.message}
          {...(path ? { 'data-autofocus': true } : {})}
          {...register('text')}
        />
      </form>
    </ModalDialog>
  );
}

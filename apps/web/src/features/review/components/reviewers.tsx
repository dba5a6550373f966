import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { editableWorksheetStates, subject, type Role, type Worksheet } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { ModalDialog } from '@/components/ui/modal-dialog.tsx';
import { SelectField } from '@/components/ui/select-field.tsx';
import { useAssignReviewers } from '@/features/review/api/assign-reviewers.ts';
import { useAppAbility } from '@/lib/ability.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { applyServerErrors } from '@/lib/form-errors.ts';

/** A member who could be assigned (the app hands the organization's members in). */
export interface Assignable {
  id: string;
  name: string;
  roles: readonly Role[];
}

interface Choice {
  checkerId: string;
  approverId: string;
}

function AssignDialog({
  orgId,
  worksheet,
  people,
  onDone,
  onStale,
  onCancel,
}: {
  orgId: string;
  worksheet: Worksheet;
  people: readonly Assignable[];
  onDone: () => void;
  onStale: (message: string) => void;
  onCancel: () => void;
}) {
  const assign = useAssignReviewers(orgId, worksheet.id);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Choice>({
    defaultValues: {
      checkerId: worksheet.checker?.id ?? '',
      approverId: worksheet.approver?.id ?? '',
    },
  });
  // Separation of duties: never the author, and the checker is not the approver.
  const candidates = (role: Role) =>
    people.filter((p) => p.roles.includes(role) && p.id !== worksheet.author.id);

  async function onValid({ checkerId, approverId }: Choice) {
    setProblem(null);
    if (checkerId && checkerId === approverId) {
      setError('approverId', {
        type: 'validate',
        message: 'The checker cannot also sign: choose someone else.',
      });
      return;
    }
    try {
      await assign.mutateAsync({
        version: worksheet.version,
        checkerId: checkerId || null,
        approverId: approverId || null,
      });
      onDone();
    } catch (error) {
      if (error instanceof ApiError && error.code === 'stale-version') onStale(error.message);
      else setProblem(applyServerErrors(error, setError, ['checkerId', 'approverId']));
    }
  }

  return (
    <ModalDialog
      role="dialog"
      title="Checker and approver"
      {...(isSubmitting ? {} : { onDismiss: onCancel })}
      actions={
        <>
          <Button variant="outline" onClick={onCancel} disabled={isSubmitting}>
            Cancel
          </Button>
          <Button type="submit" form="assign-reviewers-form" disabled={isSubmitting}>
            {isSubmitting ? 'Saving…' : 'Save assignment'}
          </Button>
        </>
      }
    >
      <p>The checker checks each submitted revision; the approver signs off checked ones.</p>
      {problem ? <ErrorMessage>{problem}</ErrorMessage> : null}
      <form
        id="assign-reviewers-form"
        noValidate
        onSubmit={(event) => void handleSubmit(onValid)(event)}
        className="flex flex-col gap-3"
      >
        <SelectField
          label="Checker"
          error={errors.checkerId?.message}
          data-autofocus
          {...register('checkerId')}
        >
          <option value="">Nobody yet</option>
          {candidates('checker').map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Approver"
          error={errors.approverId?.message}
          {...register('approverId')}
        >
          <option value="">Nobody yet</option>
          {candidates('approver').map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </SelectField>
      </form>
    </ModalDialog>
  );
}

/**
 * Who checks and who signs this worksheet; the author or a manager changes it while the
 * worksheet is a draft or returned (before the next submit).
 */
export function Reviewers({
  orgId,
  worksheet,
  people,
  onChanged,
  onStale,
}: {
  orgId: string;
  worksheet: Worksheet;
  people: readonly Assignable[];
  onChanged: () => void;
  onStale: (message: string) => void;
}) {
  const ability = useAppAbility();
  const [open, setOpen] = useState(false);
  const target = subject('Worksheet', { authorId: worksheet.author.id });
  const mayAssign =
    editableWorksheetStates.includes(worksheet.state) &&
    (ability.can('assign', target) || ability.can('update', target));
  return (
    <div className="flex flex-wrap items-center gap-x-4 gap-y-1 text-sm text-ink-700">
      <span>
        Checker:{' '}
        <strong className="font-semibold">{worksheet.checker?.name ?? 'not assigned'}</strong>
      </span>
      <span>
        Approver:{' '}
        <strong className="font-semibold">{worksheet.approver?.name ?? 'not assigned'}</strong>
      </span>
      {mayAssign ? (
        <Button size="sm" variant="quiet" onClick={() => setOpen(true)}>
          Assign checker and approver
        </Button>
      ) : null}
      {open ? (
        <AssignDialog
          orgId={orgId}
          worksheet={worksheet}
          people={people}
          onDone={() => {
            setOpen(false);
            onChanged();
          }}
          onStale={(message) => {
            setOpen(false);
            onStale(message);
          }}
          onCancel={() => setOpen(false)}
        />
      ) : null}
    </div>
  );
}

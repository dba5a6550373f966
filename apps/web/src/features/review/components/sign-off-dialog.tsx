import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { transitionRequestSchema, type TransitionRequest, type Worksheet } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { ModalDialog } from '@/components/ui/modal-dialog.tsx';
import { SelectField } from '@/components/ui/select-field.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import { useTransitionWorksheet } from '@/features/review/api/transition-worksheet.ts';
import type { StepOutcome } from '@/features/review/components/transition-dialog.tsx';
import { ApiError } from '@/lib/api-client.ts';
import { formatInZone } from '@/lib/org-time.ts';

type SignBody = z.output<typeof transitionRequestSchema>;

/**
 * The approver signs the revision's content hash: a meaning from the organization's list and
 * their password again. The preview shows the manifestation the signature will carry; a wrong
 * password is said at the password and the dialog stays open.
 */
export function SignOffDialog({
  orgId,
  worksheet,
  meanings,
  printedName,
  username,
  timeZone,
  onDone,
  onStale,
  onCancel,
}: StepOutcome & {
  orgId: string;
  worksheet: Worksheet;
  meanings: readonly string[];
  printedName: string;
  /** The signer's e-mail, so a password manager knows whose password this is. */
  username: string;
  timeZone: string;
}) {
  const transition = useTransitionWorksheet(orgId, worksheet.id);
  const [problem, setProblem] = useState<string | null>(null);
  // The server records the exact time; the preview shows when the dialog opened.
  const [openedAt] = useState(() => new Date());
  const {
    register,
    handleSubmit,
    watch,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<TransitionRequest, unknown, SignBody>({
    resolver: zodResolver(transitionRequestSchema),
    defaultValues: {
      action: 'sign',
      version: worksheet.version,
      meaning: meanings[0] ?? '',
      password: '',
    },
  });
  const meaning = watch('meaning');

  async function onValid(body: SignBody) {
    setProblem(null);
    try {
      onDone(await transition.mutateAsync(body));
    } catch (error) {
      if (error instanceof ApiError && error.code === 'stale-version') onStale(error.message);
      else if (error instanceof ApiError && error.code === 'bad-password') {
        setError('password', { type: 'server', message: error.message }, { shouldFocus: true });
      } else if (error instanceof ApiError && error.fields?.meaning) {
        setError('meaning', { type: 'server', message: error.fields.meaning });
      } else setProblem(error instanceof Error ? error.message : 'The signature failed.');
    }
  }

  return (
    <ModalDialog
      role="dialog"
      title={`Sign off revision ${worksheet.revision}`}
      {...(isSubmitting ? {} : { onDismiss: onCancel })}
      actions={
        <>
          <Button variant="outline" onClick={onCancel} disabled={isSubmitting}>
            Cancel
          </Button>
          <Button type="submit" form="sign-off-form" disabled={isSubmitting}>
            {isSubmitting ? 'Signing…' : `Sign revision ${worksheet.revision}`}
          </Button>
        </>
      }
    >
      <p>
        Your signature binds to this exact content of “{worksheet.title}”. It cannot be moved to
        another revision or taken back; a change means a new revision and a new signature.
      </p>
      {problem ? <ErrorMessage>{problem}</ErrorMessage> : null}
      <form
        id="sign-off-form"
        noValidate
        onSubmit={(event) => void handleSubmit(onValid)(event)}
        className="flex flex-col gap-3"
      >
        <input type="email" autoComplete="username" value={username} readOnly hidden />
        <SelectField
          label="Meaning of your signature"
          error={errors.meaning?.message}
          data-autofocus
          {...register('meaning')}
        >
          {meanings.map((m) => (
            <option key={m} value={m}>
              {m}
            </option>
          ))}
        </SelectField>
        <TextField
          label="Your password"
          type="password"
          autoComplete="current-password"
          hint="Entered again to sign; it is checked, never stored with the signature."
          error={errors.password?.message}
          {...register('password')}
        />
      </form>
      <section
        aria-label="Signature preview"
        className="rounded-md border border-ink-300 bg-paper px-3 py-2 text-sm"
      >
        <h3 className="font-semibold text-ink-900">The signature will read</h3>
        <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-ink-900">
          <dt className="text-ink-600">Signed by</dt>
          <dd className="font-semibold">{printedName}</dd>
          <dt className="text-ink-600">Meaning</dt>
          <dd>{meaning}</dd>
          <dt className="text-ink-600">Date and time</dt>
          <dd>{formatInZone(openedAt, timeZone)} (recorded when you sign)</dd>
          <dt className="text-ink-600">Revision</dt>
          <dd className="font-mono">{worksheet.revision}</dd>
          <dt className="text-ink-600">Content hash</dt>
          <dd className="font-mono text-xs break-all">
            SHA-256 {worksheet.currentRevision.contentHash}
          </dd>
        </dl>
      </section>
      <p className="text-sm text-ink-700">
        <strong className="font-semibold">Caution:</strong> the results are engineering aids, not a
        substitute for qualified review. Safety-related designs and circuits with hazardous voltages
        follow local codes and licensed engineering practice.
      </p>
    </ModalDialog>
  );
}

import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { useSearchParams } from 'react-router-dom';
import { z } from 'zod';
import { passwordResetConfirmSchema } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { FormPage } from '@/components/ui/form-page.tsx';
import { ErrorMessage, SuccessMessage } from '@/components/ui/message.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import { TextLink } from '@/components/ui/text-link.tsx';
import { useConfirmPasswordReset } from '@/features/auth/api/confirm-password-reset.ts';
import { applyServerErrors } from '@/lib/form-errors.ts';
import { samePasswordTwice } from '@/lib/repeat-password.ts';
import { endSession } from '@/lib/session.ts';

const resetFormSchema = passwordResetConfirmSchema
  .pick({ password: true })
  .extend({ repeatPassword: z.string() })
  .superRefine(samePasswordTwice('password'));
type ResetForm = z.infer<typeof resetFormSchema>;

/** `/reset-password?token=…`, the page the reset e-mail links to. */
export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const queryClient = useQueryClient();
  const confirmReset = useConfirmPasswordReset();
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<ResetForm>({
    resolver: zodResolver(resetFormSchema),
    defaultValues: { password: '', repeatPassword: '' },
  });

  async function onValid({ password }: ResetForm) {
    setFormError(null);
    try {
      await confirmReset.mutateAsync({ token, password });
      // The server ended every session of this person, this browser's included.
      endSession(queryClient);
      setDone(true);
    } catch (error) {
      setFormError(applyServerErrors(error, setError, ['password']));
    }
  }

  if (!passwordResetConfirmSchema.shape.token.safeParse(token).success) {
    return (
      <FormPage title="Choose a new password">
        <ErrorMessage>
          This reset link is not complete. Open the link from the e-mail again.
        </ErrorMessage>
        <p className="text-sm">
          <TextLink to="/forgot-password">Ask for a new link</TextLink>
        </p>
      </FormPage>
    );
  }

  if (done) {
    return (
      <FormPage title="Password changed">
        <SuccessMessage>
          Your new password is set, and every session that used the old one has been signed out.
        </SuccessMessage>
        <p className="text-sm">
          <TextLink to="/sign-in">Sign in with your new password</TextLink>
        </p>
      </FormPage>
    );
  }

  return (
    <FormPage title="Choose a new password" intro="Use at least 12 characters.">
      {formError ? (
        <ErrorMessage>
          {formError}{' '}
          <TextLink to="/forgot-password" className="text-fault">
            Ask for a new link
          </TextLink>
        </ErrorMessage>
      ) : null}
      <form
        noValidate
        className="flex flex-col gap-4"
        onSubmit={(event) => void handleSubmit(onValid)(event)}
      >
        <TextField
          label="New password"
          type="password"
          autoComplete="new-password"
          error={errors.password?.message}
          {...register('password')}
        />
        <TextField
          label="Repeat the new password"
          type="password"
          autoComplete="new-password"
          error={errors.repeatPassword?.message}
          {...register('repeatPassword')}
        />
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : 'Set new password'}
        </Button>
      </form>
    </FormPage>
  );
}

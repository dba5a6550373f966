import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { changePasswordRequestSchema } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage, SuccessMessage } from '@/components/ui/message.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import { useChangePassword } from '@/features/profile/api/change-password.ts';
import { applyServerErrors } from '@/lib/form-errors.ts';
import { samePasswordTwice } from '@/lib/repeat-password.ts';

const passwordFormSchema = changePasswordRequestSchema
  .extend({ repeatPassword: z.string() })
  .superRefine(samePasswordTwice('newPassword'));
type PasswordForm = z.infer<typeof passwordFormSchema>;

const empty: PasswordForm = { currentPassword: '', newPassword: '', repeatPassword: '' };

export function ChangePasswordForm({ email }: { email: string }) {
  const change = useChangePassword();
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<PasswordForm>({ resolver: zodResolver(passwordFormSchema), defaultValues: empty });

  async function onValid({ currentPassword, newPassword }: PasswordForm) {
    setMessage(null);
    try {
      await change.mutateAsync({ currentPassword, newPassword });
      reset(empty);
      setMessage({
        ok: true,
        text: 'Your password is changed. Other browsers signed in as you were signed out.',
      });
    } catch (error) {
      const text = applyServerErrors(error, setError, ['currentPassword', 'newPassword']);
      if (text) setMessage({ ok: false, text });
    }
  }

  return (
    <form
      noValidate
      className="flex max-w-md flex-col gap-4"
      onSubmit={(event) => void handleSubmit(onValid)(event)}
    >
      {message?.ok ? <SuccessMessage>{message.text}</SuccessMessage> : null}
      {message && !message.ok ? <ErrorMessage>{message.text}</ErrorMessage> : null}
      {/* Lets password managers file the new password under the right account. */}
      <input type="email" autoComplete="username" value={email} readOnly hidden />
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        error={errors.currentPassword?.message}
        {...register('currentPassword')}
      />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 12 characters."
        error={errors.newPassword?.message}
        {...register('newPassword')}
      />
      <TextField
        label="Repeat the new password"
        type="password"
        autoComplete="new-password"
        error={errors.repeatPassword?.message}
        {...register('repeatPassword')}
      />
      <div>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Changing…' : 'Change password'}
        </Button>
      </div>
    </form>
  );
}

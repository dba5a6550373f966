import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { useNavigate } from 'react-router-dom';
import { z } from 'zod';
import { acceptInvitationNewAccountSchema } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import { useAcceptInvitation } from '@/features/invitations/api/accept-invitation.ts';
import type { InvitationPreview } from '@/features/invitations/api/get-invitation-preview.ts';
import { joinedOrgPath } from '@/features/invitations/components/landing-path.ts';
import { applyServerErrors } from '@/lib/form-errors.ts';
import { samePasswordTwice } from '@/lib/repeat-password.ts';

const newAccountFormSchema = acceptInvitationNewAccountSchema
  .extend({ repeatPassword: z.string() })
  .superRefine(samePasswordTwice('password'));
type NewAccountFormInput = z.input<typeof newAccountFormSchema>;
type NewAccountFormValues = z.output<typeof newAccountFormSchema>;

interface NewAccountFormProps {
  token: string;
  invitation: InvitationPreview;
}

/** A person new to Biasproof chooses a name and password, joins and is signed in. */
export function NewAccountForm({ token, invitation }: NewAccountFormProps) {
  const accept = useAcceptInvitation(token);
  const navigate = useNavigate();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<NewAccountFormInput, unknown, NewAccountFormValues>({
    resolver: zodResolver(newAccountFormSchema),
    defaultValues: { name: '', password: '', repeatPassword: '' },
  });

  async function onValid({ name, password }: NewAccountFormValues) {
    setFormError(null);
    try {
      const me = await accept.mutateAsync({ name, password });
      await navigate(joinedOrgPath(me, invitation), { replace: true });
    } catch (error) {
      setFormError(applyServerErrors(error, setError, ['name', 'password']));
    }
  }

  return (
    <>
      {formError ? <ErrorMessage>{formError}</ErrorMessage> : null}
      <form
        noValidate
        className="flex flex-col gap-4"
        onSubmit={(event) => void handleSubmit(onValid)(event)}
      >
        <TextField
          label="E-mail"
          type="email"
          autoComplete="username"
          value={invitation.email}
          readOnly
          hint="The invited address; it becomes your sign-in."
        />
        <TextField
          label="Your name"
          autoComplete="name"
          hint="As colleagues will see it on worksheets and signatures."
          error={errors.name?.message}
          {...register('name')}
        />
        <TextField
          label="Password"
          type="password"
          autoComplete="new-password"
          hint="At least 12 characters."
          error={errors.password?.message}
          {...register('password')}
        />
        <TextField
          label="Repeat the password"
          type="password"
          autoComplete="new-password"
          error={errors.repeatPassword?.message}
          {...register('repeatPassword')}
        />
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Joining…' : `Create account and join`}
        </Button>
      </form>
    </>
  );
}

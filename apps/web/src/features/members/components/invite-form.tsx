import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { createInvitationRequestSchema, type CreateInvitationRequest } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import {
  useCreateInvitation,
  type CreateInvitationValues,
} from '@/features/members/api/create-invitation.ts';
import type { OnFeedback } from '@/features/members/components/feedback.ts';
import { RoleCheckboxes } from '@/features/members/components/role-checkboxes.tsx';
import { applyServerErrors } from '@/lib/form-errors.ts';
import { useCurrentOrg } from '@/lib/current-org.tsx';

/** An admin invites an e-mail address with roles; the invitee gets a link valid 7 days. */
export function InviteForm({ onFeedback }: { onFeedback: OnFeedback }) {
  const { membership } = useCurrentOrg();
  const create = useCreateInvitation(membership.orgId);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    setFocus,
    formState: { errors, isSubmitting },
  } = useForm<CreateInvitationRequest, unknown, CreateInvitationValues>({
    resolver: zodResolver(createInvitationRequestSchema),
    defaultValues: { email: '', roles: [] },
  });

  async function onValid(values: CreateInvitationValues) {
    setFormError(null);
    try {
      const invitation = await create.mutateAsync(values);
      reset();
      setFocus('email');
      onFeedback({ tone: 'ok', text: `Invitation sent to ${invitation.email}.` });
    } catch (error) {
      setFormError(applyServerErrors(error, setError, ['email', 'roles']));
    }
  }

  return (
    <form
      noValidate
      aria-labelledby="invite-heading"
      className="flex flex-col gap-4"
      onSubmit={(event) => void handleSubmit(onValid)(event)}
    >
      {formError ? <ErrorMessage>{formError}</ErrorMessage> : null}
      <TextField
        label="E-mail of the person to invite"
        type="email"
        autoComplete="off"
        className="max-w-md"
        error={errors.email?.message}
        {...register('email')}
      />
      <RoleCheckboxes
        legend="Roles"
        registration={register('roles')}
        error={errors.roles?.message ?? errors.roles?.root?.message}
      />
      <div>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Sending…' : 'Send invitation'}
        </Button>
      </div>
    </form>
  );
}

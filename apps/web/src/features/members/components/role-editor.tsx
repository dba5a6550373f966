import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useState, type KeyboardEvent } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { roleListSchema, type Member, type Role } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { useUpdateMember } from '@/features/members/api/update-member.ts';
import type { OnFeedback } from '@/features/members/components/feedback.ts';
import { RoleCheckboxes } from '@/features/members/components/role-checkboxes.tsx';
import { applyServerErrors } from '@/lib/form-errors.ts';

const roleFormSchema = z.object({ roles: roleListSchema });
type RoleFormInput = z.input<typeof roleFormSchema>;
type RoleFormValues = z.output<typeof roleFormSchema>;

interface RoleEditorProps {
  orgId: string;
  member: Member;
  onDone: () => void;
  onFeedback: OnFeedback;
}

/** Inline role editing in a member's row: tick the roles, save or cancel (Escape cancels). */
export function RoleEditor({ orgId, member, onDone, onFeedback }: RoleEditorProps) {
  const update = useUpdateMember(orgId);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    setFocus,
    formState: { errors, isSubmitting },
  } = useForm<RoleFormInput, unknown, RoleFormValues>({
    resolver: zodResolver(roleFormSchema),
    defaultValues: { roles: [...member.roles] as Role[] },
  });

  useEffect(() => setFocus('roles'), [setFocus]);

  async function onValid({ roles }: RoleFormValues) {
    setFormError(null);
    try {
      await update.mutateAsync({ userId: member.userId, roles });
      onFeedback({ tone: 'ok', text: `Roles of ${member.name} saved.` });
      onDone();
    } catch (error) {
      setFormError(applyServerErrors(error, setError, ['roles']));
    }
  }

  function cancelOnEscape(event: KeyboardEvent<HTMLFormElement>) {
    if (event.key === 'Escape') {
      event.preventDefault();
      onDone();
    }
  }

  return (
    <form
      noValidate
      onKeyDown={cancelOnEscape}
      onSubmit={(event) => void handleSubmit(onValid)(event)}
      className="flex flex-col gap-2"
    >
      <RoleCheckboxes
        compact
        legend={`Roles of ${member.name}`}
        registration={register('roles')}
        error={errors.roles?.message ?? errors.roles?.root?.message}
      />
      {formError ? (
        <p role="alert" className="text-sm font-semibold text-fault">
          {formError}
        </p>
      ) : null}
      <div className="flex gap-2">
        <Button type="submit" size="sm" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : 'Save roles'}
        </Button>
        <Button size="sm" variant="outline" onClick={onDone} disabled={isSubmitting}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

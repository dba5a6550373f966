import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { useNavigate } from 'react-router-dom';
import type { z } from 'zod';
import {
  createWorksheetRequestSchema,
  type CreateWorksheetRequest,
  type Project,
} from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { SelectField } from '@/components/ui/select-field.tsx';
import { TextAreaField } from '@/components/ui/text-area-field.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import { useCreateWorksheet } from '@/features/worksheets/api/create-worksheet.ts';
import { applyServerErrors } from '@/lib/form-errors.ts';
import { orgPath, useCurrentOrg } from '@/lib/current-org.tsx';

type NewWorksheetValues = z.output<typeof createWorksheetRequestSchema>;

/** Project, title and description of a new, empty worksheet; it opens once created. */
export function NewWorksheetForm({
  projects,
  projectId = '',
  onCancel,
}: {
  /** Active projects (archived ones take no new worksheets). */
  projects: readonly Project[];
  projectId?: string;
  onCancel: () => void;
}) {
  const { membership } = useCurrentOrg();
  const navigate = useNavigate();
  const create = useCreateWorksheet(membership.orgId);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<CreateWorksheetRequest, unknown, NewWorksheetValues>({
    resolver: zodResolver(createWorksheetRequestSchema),
    defaultValues: {
      projectId: projectId || (projects.length === 1 ? projects[0]!.id : ''),
      title: '',
      description: '',
    },
  });

  async function onValid(values: NewWorksheetValues) {
    setFormError(null);
    try {
      const worksheet = await create.mutateAsync(values);
      await navigate(orgPath(membership.orgSlug, `worksheets/${worksheet.id}`));
    } catch (error) {
      setFormError(applyServerErrors(error, setError, ['projectId', 'title', 'description']));
    }
  }

  return (
    <form
      noValidate
      aria-labelledby="new-worksheet-heading"
      className="flex flex-col gap-4"
      onSubmit={(event) => void handleSubmit(onValid)(event)}
    >
      {formError ? <ErrorMessage>{formError}</ErrorMessage> : null}
      <div className="grid gap-4 sm:grid-cols-[1fr_2fr]">
        <SelectField label="Project" error={errors.projectId?.message} {...register('projectId')}>
          <option value="">Choose a project…</option>
          {projects.map((p) => (
            <option key={p.id} value={p.id}>
              {p.code} · {p.name}
            </option>
          ))}
        </SelectField>
        <TextField
          label="Title"
          hint="The analog block, e.g. “Input clamp, channel A”."
          error={errors.title?.message}
          {...register('title')}
        />
      </div>
      <TextAreaField
        label="Block description"
        hint="What the block does and what it must meet."
        error={errors.description?.message}
        {...register('description')}
      />
      <div className="flex gap-3">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Creating…' : 'Create and open'}
        </Button>
        <Button variant="outline" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

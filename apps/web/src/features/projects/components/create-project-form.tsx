import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import {
  createProjectRequestSchema,
  type CreateProjectRequest,
  type Project,
} from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { TextAreaField } from '@/components/ui/text-area-field.tsx';
import { TextField } from '@/components/ui/text-field.tsx';
import { useCreateProject } from '@/features/projects/api/create-project.ts';
import { applyServerErrors } from '@/lib/form-errors.ts';
import { useCurrentOrg } from '@/lib/current-org.tsx';

type CreateProjectValues = z.output<typeof createProjectRequestSchema>;

/** Name, short code and description of a new project; the server's field errors land on the fields. */
export function CreateProjectForm({ onCreated }: { onCreated: (project: Project) => void }) {
  const { membership } = useCurrentOrg();
  const create = useCreateProject(membership.orgId);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    setFocus,
    formState: { errors, isSubmitting },
  } = useForm<CreateProjectRequest, unknown, CreateProjectValues>({
    resolver: zodResolver(createProjectRequestSchema),
    defaultValues: { name: '', code: '', description: '' },
  });

  async function onValid(values: CreateProjectValues) {
    setFormError(null);
    try {
      const project = await create.mutateAsync(values);
      reset();
      setFocus('name');
      onCreated(project);
    } catch (error) {
      setFormError(applyServerErrors(error, setError, ['name', 'code', 'description']));
    }
  }

  return (
    <form
      noValidate
      aria-labelledby="new-project-heading"
      className="flex flex-col gap-4"
      onSubmit={(event) => void handleSubmit(onValid)(event)}
    >
      {formError ? <ErrorMessage>{formError}</ErrorMessage> : null}
      <div className="grid gap-4 sm:grid-cols-[2fr_1fr]">
        <TextField label="Project name" error={errors.name?.message} {...register('name')} />
        <TextField
          label="Code"
          hint="Short, e.g. PWR-2; shown beside its worksheets."
          autoCapitalize="characters"
          error={errors.code?.message}
          {...register('code')}
        />
      </div>
      <TextAreaField
        label="Description"
        error={errors.description?.message}
        {...register('description')}
      />
      <div>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Creating…' : 'Create project'}
        </Button>
      </div>
    </form>
  );
}

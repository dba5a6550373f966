import { useState } from 'react';
import type { ProjectListQuery } from '@biasproof/shared';
import { Card } from '@/components/ui/card.tsx';
import { EmptyState } from '@/components/ui/empty-state.tsx';
import { ErrorMessage, SuccessMessage } from '@/components/ui/message.tsx';
import { SelectField } from '@/components/ui/select-field.tsx';
import { SkeletonRows } from '@/components/ui/skeleton-rows.tsx';
import { CreateProjectForm } from '@/features/projects/components/create-project-form.tsx';
import { ProjectsTable } from '@/features/projects/components/projects-table.tsx';
import { Can, useAppAbility } from '@/lib/ability.tsx';
import { useProjects } from '@/lib/api/list-projects.ts';
import { useCurrentOrg } from '@/lib/current-org.tsx';

type Shown = NonNullable<ProjectListQuery['archived']>;

const emptyText: Record<Shown, string> = {
  false: 'No active projects yet.',
  true: 'No archived projects.',
  all: 'No projects yet.',
};

/** `/o/:orgSlug/projects`: the organization's projects; authors and managers create and archive. */
export function ProjectsPage() {
  const { membership } = useCurrentOrg();
  const ability = useAppAbility();
  const [shown, setShown] = useState<Shown>('false');
  const projects = useProjects(membership.orgId, { archived: shown });
  const [feedback, setFeedback] = useState<{ text: string; tone: 'ok' | 'error' } | null>(null);
  const canCreate = ability.can('create', 'Project');

  let body;
  if (projects.isPending) body = <SkeletonRows label="Loading projects…" columns={4} />;
  else if (projects.isError) body = <ErrorMessage>{projects.error.message}</ErrorMessage>;
  else if (projects.data.items.length === 0) {
    body = (
      <EmptyState title={emptyText[shown]}>
        {shown === 'true'
          ? 'Archived projects appear here.'
          : canCreate
            ? 'Create the first one with the form below; its worksheets will be listed under it.'
            : 'An author or a manager of this organization creates projects.'}
      </EmptyState>
    );
  } else {
    body = (
      <ProjectsTable
        projects={projects.data.items}
        total={projects.data.total}
        canUpdate={ability.can('update', 'Project')}
        onFeedback={(text, tone) => setFeedback({ text, tone })}
      />
    );
  }

  return (
    <div className="mx-auto flex w-full max-w-6xl flex-col gap-8">
      <title>{`Projects · ${membership.orgName} · Biasproof`}</title>
      <div>
        <p className="text-sm font-semibold text-ink-600">{membership.orgName}</p>
        <h1 className="text-3xl font-bold text-ink-900">Projects</h1>
      </div>

      {feedback?.tone === 'ok' ? <SuccessMessage>{feedback.text}</SuccessMessage> : null}
      {feedback?.tone === 'error' ? <ErrorMessage>{feedback.text}</ErrorMessage> : null}

      <Card aria-labelledby="projects-heading" className="flex flex-col gap-4">
        <div className="flex flex-wrap items-center justify-between gap-4">
          <h2 id="projects-heading" className="text-lg font-semibold text-ink-900">
            Projects of {membership.orgName}
          </h2>
          <SelectField
            label="Show"
            value={shown}
            onChange={(e) => setShown(e.currentTarget.value as Shown)}
          >
            <option value="false">Active projects</option>
            <option value="true">Archived projects</option>
            <option value="all">All projects</option>
          </SelectField>
        </div>
        <div aria-busy={projects.isFetching}>{body}</div>
      </Card>

      <Can I="create" a="Project">
        <Card aria-labelledby="new-project-heading">
          <h2 id="new-project-heading" className="mb-4 text-lg font-semibold text-ink-900">
            New project
          </h2>
          <CreateProjectForm
            onCreated={(project) =>
              setFeedback({
                text: `Project ${project.name} (${project.code}) created.`,
                tone: 'ok',
              })
            }
          />
        </Card>
      </Can>
    </div>
  );
}

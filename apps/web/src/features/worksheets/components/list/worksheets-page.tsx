import { useEffect, useState } from 'react';
import { useParams } from 'react-router-dom';
import type { PersonRef, Project } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { Card } from '@/components/ui/card.tsx';
import { Chip } from '@/components/ui/chip.tsx';
import { EmptyState } from '@/components/ui/empty-state.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { Pagination } from '@/components/ui/pagination.tsx';
import { SkeletonRows } from '@/components/ui/skeleton-rows.tsx';
import { TextLink } from '@/components/ui/text-link.tsx';
import { worksheetsExportUrl } from '@/features/worksheets/api/export-worksheets-csv.ts';
import { useWorksheets } from '@/features/worksheets/api/list-worksheets.ts';
import {
  PAGE_SIZE,
  toExportQuery,
  toListQuery,
  useListParams,
  type ListParams,
} from '@/features/worksheets/components/list/list-params.ts';
import { NewWorksheetForm } from '@/features/worksheets/components/list/new-worksheet-form.tsx';
import { WorksheetFilters } from '@/features/worksheets/components/list/worksheet-filters.tsx';
import { WorksheetsTable } from '@/features/worksheets/components/list/worksheets-table.tsx';
import { useAppAbility } from '@/lib/ability.tsx';
import { useProjects } from '@/lib/api/list-projects.ts';
import { orgPath, useCurrentOrg } from '@/lib/current-org.tsx';

const isFiltered = (p: ListParams, onProjectPage: boolean) =>
  Boolean(p.q || p.state || p.author || p.assignedToMe || (p.projectId && !onProjectPage));

/** Authors met in the list so far, for the author filter (kept when a filter hides them). */
function useAuthorsSeen(items: readonly { author: PersonRef }[] | undefined): PersonRef[] {
  const [seen, setSeen] = useState<PersonRef[]>([]);
  useEffect(() => {
    if (!items) return;
    setSeen((before) => {
      const fresh = items.map((i) => i.author).filter((a) => !before.some((b) => b.id === a.id));
      if (fresh.length === 0) return before;
      const unique = fresh.filter((a, i) => fresh.findIndex((b) => b.id === a.id) === i);
      return [...before, ...unique].sort((a, b) => a.name.localeCompare(b.name));
    });
  }, [items]);
  return seen;
}

function ProjectHeading({ project }: { project: Project | undefined }) {
  const { membership } = useCurrentOrg();
  return (
    <div>
      <p className="text-sm font-semibold text-ink-600">
        <TextLink to={orgPath(membership.orgSlug, 'projects')}>Projects</TextLink> ·{' '}
        {membership.orgName}
      </p>
      <h1 className="flex flex-wrap items-center gap-3 text-3xl font-bold text-ink-900">
        {project ? project.name : 'Project'}
        {project ? (
          <span className="font-mono text-lg font-semibold text-ink-600">{project.code}</span>
        ) : null}
        {project?.archived ? <Chip>archived</Chip> : null}
      </h1>
      {project?.description ? (
        <p className="mt-2 max-w-3xl text-ink-700">{project.description}</p>
      ) : null}
    </div>
  );
}

/**
 * `/o/:orgSlug/worksheets` and `/o/:orgSlug/projects/:projectId`: the worksheets, filtered,
 * searched, sorted and paged on the server; "New worksheet" creates one and opens it.
 */
export function WorksheetsPage() {
  const { projectId } = useParams();
  const { membership, user } = useCurrentOrg();
  const ability = useAppAbility();
  const { params, update } = useListParams(projectId);
  const list = useWorksheets(membership.orgId, toListQuery(params, user.id));
  const projects = useProjects(membership.orgId, { archived: 'all' });
  const authors = useAuthorsSeen(list.data?.items);
  const [creating, setCreating] = useState(false);
  const project = projectId ? projects.data?.items.find((p) => p.id === projectId) : undefined;
  const activeProjects = projects.data?.items.filter((p) => !p.archived) ?? [];
  const canCreate = ability.can('create', 'Worksheet') && !project?.archived;
  const title = projectId ? (project?.name ?? 'Project') : 'Worksheets';

  let body;
  if (list.isPending) body = <SkeletonRows label="Loading worksheets…" columns={5} />;
  else if (list.isError) body = <ErrorMessage>{list.error.message}</ErrorMessage>;
  else if (list.data.items.length === 0) {
    body = isFiltered(params, Boolean(projectId)) ? (
      <EmptyState title="No worksheet matches these filters.">
        Clear the search or choose other filters.
      </EmptyState>
    ) : (
      <EmptyState title={projectId ? 'This project has no worksheets yet.' : 'No worksheets yet.'}>
        {canCreate
          ? 'Choose “New worksheet” to capture an analog block; it opens in the editor.'
          : 'Authors create worksheets; they appear here once they exist.'}
      </EmptyState>
    );
  } else {
    body = (
      <div className="flex flex-col gap-4">
        <WorksheetsTable
          items={list.data.items}
          total={list.data.total}
          params={params}
          hideProject={Boolean(projectId)}
          onSort={(sort, dir) => update({ sort, dir })}
        />
        <Pagination
          page={params.page}
          pageSize={PAGE_SIZE}
          total={list.data.total}
          onPage={(page) => update({ page })}
        />
      </div>
    );
  }

  return (
    <div className="mx-auto flex w-full max-w-6xl flex-col gap-8">
      <title>{`${title} · ${membership.orgName} · Biasproof`}</title>
      <div className="flex flex-wrap items-end justify-between gap-4">
        {projectId ? (
          <ProjectHeading project={project} />
        ) : (
          <div>
            <p className="text-sm font-semibold text-ink-600">{membership.orgName}</p>
            <h1 className="text-3xl font-bold text-ink-900">Worksheets</h1>
          </div>
        )}
        {canCreate && !creating ? (
          <Button onClick={() => setCreating(true)}>New worksheet</Button>
        ) : null}
      </div>

      {creating ? (
        <Card aria-labelledby="new-worksheet-heading">
          <h2 id="new-worksheet-heading" className="mb-4 text-lg font-semibold text-ink-900">
            New worksheet
          </h2>
          {activeProjects.length === 0 && !projects.isPending ? (
            <p className="text-ink-700">
              Worksheets belong to a project; create one on the{' '}
              <TextLink to={orgPath(membership.orgSlug, 'projects')}>Projects</TextLink> page first.
            </p>
          ) : (
            <NewWorksheetForm
              projects={activeProjects}
              projectId={projectId ?? params.projectId}
              onCancel={() => setCreating(false)}
            />
          )}
        </Card>
      ) : null}

      <Card aria-labelledby="worksheets-heading" className="flex flex-col gap-5">
        <h2 id="worksheets-heading" className="sr-only">
          {projectId ? `Worksheets of ${title}` : 'All worksheets'}
        </h2>
        <WorksheetFilters
          params={params}
          update={update}
          projects={projectId ? undefined : (projects.data?.items ?? [])}
          authors={authors}
          userId={user.id}
        />
        <p className="flex flex-wrap items-baseline justify-end gap-x-2 text-xs text-ink-600">
          <a
            href={worksheetsExportUrl(membership.orgId, toExportQuery(params, user.id))}
            download
            className="rounded-md border border-ink-500 bg-surface px-2.5 py-1 text-sm font-semibold text-ink-900 hover:bg-paper focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent"
          >
            Download CSV
          </a>
          every worksheet matching these filters, in this order, all pages
        </p>
        <div aria-busy={list.isFetching}>{body}</div>
      </Card>
    </div>
  );
}

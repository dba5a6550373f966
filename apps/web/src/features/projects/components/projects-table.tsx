import { Link } from 'react-router-dom';
import type { Project } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { Chip } from '@/components/ui/chip.tsx';
import { useUpdateProject } from '@/features/projects/api/update-project.ts';
import { orgPath, useCurrentOrg } from '@/lib/current-org.tsx';

const head = 'px-3 py-2 text-left text-xs font-semibold uppercase tracking-wide text-ink-600';
const cell = 'px-3 py-2 align-top text-sm text-ink-900';

interface ProjectsTableProps {
  projects: readonly Project[];
  total: number;
  /** Show archive / restore buttons (the person may update projects). */
  canUpdate: boolean;
  onFeedback: (text: string, tone: 'ok' | 'error') => void;
}

function ArchiveButton({
  project,
  onFeedback,
}: Pick<ProjectsTableProps, 'onFeedback'> & { project: Project }) {
  const { membership } = useCurrentOrg();
  const update = useUpdateProject(membership.orgId);
  const archive = !project.archived;
  return (
    <Button
      size="sm"
      variant="quiet"
      disabled={update.isPending}
      aria-label={`${archive ? 'Archive' : 'Restore'} ${project.name}`}
      onClick={() =>
        update.mutate(
          { projectId: project.id, archived: archive },
          {
            onSuccess: () =>
              onFeedback(
                archive
                  ? `${project.name} is archived: it stays readable and takes no new worksheets.`
                  : `${project.name} is active again.`,
                'ok',
              ),
            onError: (error) => onFeedback(error.message, 'error'),
          },
        )
      }
    >
      {archive ? 'Archive' : 'Restore'}
    </Button>
  );
}

export function ProjectsTable({ projects, total, canUpdate, onFeedback }: ProjectsTableProps) {
  const { membership } = useCurrentOrg();
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse">
        <caption className="sr-only">
          Projects of {membership.orgName} ({total})
        </caption>
        <thead className="border-b border-rule">
          <tr>
            <th scope="col" className={head}>
              Project
            </th>
            <th scope="col" className={head}>
              Code
            </th>
            <th scope="col" className={`${head} text-right`}>
              Worksheets
            </th>
            <th scope="col" className={head}>
              Status
            </th>
            {canUpdate ? (
              <th scope="col" className={head}>
                <span className="sr-only">Actions</span>
              </th>
            ) : null}
          </tr>
        </thead>
        <tbody>
          {projects.map((project) => (
            <tr key={project.id} className="border-b border-rule last:border-b-0 hover:bg-paper">
              <th scope="row" className={`${cell} text-left font-normal`}>
                <Link
                  to={orgPath(membership.orgSlug, `projects/${project.id}`)}
                  className="font-semibold text-accent underline-offset-2 hover:underline focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent"
                >
                  {project.name}
                </Link>
                {project.description ? (
                  <p className="mt-0.5 line-clamp-2 text-xs text-ink-600">{project.description}</p>
                ) : null}
              </th>
              <td className={`${cell} font-mono`}>{project.code}</td>
              <td className={`${cell} text-right tabular-nums`}>{project.worksheetCount}</td>
              <td className={cell}>
                {project.archived ? <Chip>archived</Chip> : <Chip tone="ok">active</Chip>}
              </td>
              {canUpdate ? (
                <td className={`${cell} text-right`}>
                  <ArchiveButton project={project} onFeedback={onFeedback} />
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

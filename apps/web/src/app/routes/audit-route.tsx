import { useMemo } from 'react';
import { AuditPage } from '@/features/audit/components/audit-page.tsx';
import { useMembers } from '@/features/members/api/list-members.ts';
import { useWorksheets } from '@/features/worksheets/api/list-worksheets.ts';
import { useProjects } from '@/lib/api/list-projects.ts';
import { useCurrentOrg } from '@/lib/current-org.tsx';

/**
 * `/o/:orgSlug/audit`: the audit log, with the people, projects and worksheets its filters
 * offer (read here, from the features that own them).
 */
export function AuditRoute() {
  const { orgId } = useCurrentOrg().membership;
  const members = useMembers(orgId);
  const projects = useProjects(orgId, { archived: 'all', limit: 100 });
  const worksheets = useWorksheets(orgId, { sort: 'title', dir: 'asc', limit: 100 });
  const people = useMemo(
    () => (members.data?.items ?? []).map((m) => ({ id: m.userId, label: m.name })),
    [members.data],
  );
  const projectOptions = useMemo(
    () => (projects.data?.items ?? []).map((p) => ({ id: p.id, label: `${p.code} · ${p.name}` })),
    [projects.data],
  );
  const worksheetOptions = useMemo(
    () => (worksheets.data?.items ?? []).map((w) => ({ id: w.id, label: w.title })),
    [worksheets.data],
  );
  return <AuditPage people={people} projects={projectOptions} worksheets={worksheetOptions} />;
}

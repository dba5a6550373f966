import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Card } from '@/components/ui/card.tsx';
import { EmptyState } from '@/components/ui/empty-state.tsx';
import { ErrorMessage } from '@/components/ui/message.tsx';
import { Pagination } from '@/components/ui/pagination.tsx';
import { SkeletonRows } from '@/components/ui/skeleton-rows.tsx';
import { auditExportUrl } from '@/features/audit/api/export-audit-csv.ts';
import { useAuditEvents } from '@/features/audit/api/list-audit-events.ts';
import { AuditFiltersForm, type FilterOption } from '@/features/audit/components/audit-filters.tsx';
import {
  AUDIT_PAGE_SIZE,
  filtersFrom,
  pageFrom,
  paramsOf,
  queryOf,
} from '@/features/audit/components/audit-params.ts';
import { AuditTable } from '@/features/audit/components/audit-table.tsx';
import { ChainBadge } from '@/features/audit/components/chain-badge.tsx';
import { useAppAbility } from '@/lib/ability.tsx';
import { useOrganization } from '@/lib/api/get-organization.ts';
import { useCurrentOrg } from '@/lib/current-org.tsx';

interface AuditPageProps {
  people: readonly FilterOption[];
  projects: readonly FilterOption[];
  worksheets: readonly FilterOption[];
}

/**
 * `/o/:orgSlug/audit` (managers and admins): the organization's audit log, filtered by what the
 * address says, with the chain's verification and a CSV export of the filtered rows (managers).
 */
export function AuditPage(props: AuditPageProps) {
  const { membership } = useCurrentOrg();
  if (!useAppAbility().can('read', 'AuditLog')) {
    return (
      <div className="mx-auto w-full max-w-3xl">
        <title>{`Audit log · ${membership.orgName} · Biasproof`}</title>
        <h1 className="text-3xl font-bold text-ink-900">Audit log</h1>
        <p className="mt-3 text-ink-700">
          Managers and admins read the audit log of {membership.orgName}.
        </p>
      </div>
    );
  }
  return <AuditLog {...props} />;
}

function AuditLog({ people, projects, worksheets }: AuditPageProps) {
  const { membership } = useCurrentOrg();
  const orgId = membership.orgId;
  const mayExport = useAppAbility().can('export', 'AuditLog');
  const [params, setParams] = useSearchParams();
  const search = params.toString();
  const filters = useMemo(() => filtersFrom(new URLSearchParams(search)), [search]);
  const page = pageFrom(params);
  const events = useAuditEvents(orgId, queryOf(filters, page));
  const timeZone = useOrganization(orgId).data?.timezone ?? 'UTC';
  const titles = useMemo(() => new Map(worksheets.map((w) => [w.id, w.label])), [worksheets]);

  return (
    <div className="mx-auto flex w-full max-w-6xl flex-col gap-6">
      <title>{`Audit log · ${membership.orgName} · Biasproof`}</title>
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="text-sm font-semibold text-ink-600">{membership.orgName}</p>
          <h1 className="text-3xl font-bold text-ink-900">Audit log</h1>
          <p className="mt-2 text-ink-700">
            Every change in the organization, chained by hashes so that an altered or removed event
            shows. Times in {timeZone}.
          </p>
        </div>
        {mayExport ? <ChainBadge orgId={orgId} /> : null}
      </div>

      <Card aria-labelledby="audit-filters-heading" className="flex flex-col gap-4">
        <h2 id="audit-filters-heading" className="text-lg font-semibold text-ink-900">
          Filters
        </h2>
        <AuditFiltersForm
          filters={filters}
          people={people}
          projects={projects}
          worksheets={worksheets}
          onApply={(next) => setParams(paramsOf(next))}
        />
      </Card>

      <Card aria-labelledby="audit-events-heading" className="flex flex-col gap-4">
        <div className="flex flex-wrap items-baseline justify-between gap-3">
          <h2 id="audit-events-heading" className="text-lg font-semibold text-ink-900">
            Events
          </h2>
          {mayExport ? (
            <a
              href={auditExportUrl(orgId, filters)}
              download
              className="rounded-md border border-ink-500 bg-surface px-3 py-1 text-sm font-semibold text-ink-900 hover:bg-paper focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent"
            >
              Export these events as CSV
            </a>
          ) : null}
        </div>
        {events.isError ? (
          <ErrorMessage>The audit log could not be loaded: {events.error.message}</ErrorMessage>
        ) : null}
        {events.isPending ? <SkeletonRows label="Loading the audit log…" columns={5} /> : null}
        {events.data && events.data.items.length === 0 ? (
          <EmptyState title="No events match these filters.">
            Widen the date range or clear a filter.
          </EmptyState>
        ) : null}
        {events.data && events.data.items.length > 0 ? (
          <div aria-busy={events.isPlaceholderData} className="flex flex-col gap-3">
            <AuditTable
              items={events.data.items}
              orgSlug={membership.orgSlug}
              timeZone={timeZone}
              worksheetTitle={(id) => titles.get(id)}
            />
            <Pagination
              page={page}
              pageSize={AUDIT_PAGE_SIZE}
              total={events.data.total}
              onPage={(p) => setParams(paramsOf(filters, p))}
            />
          </div>
        ) : null}
      </Card>
    </div>
  );
}

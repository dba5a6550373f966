import type { OrgContext } from '../orgs/org-scope.ts';
import { findOrganization } from '../orgs/repository.ts';
import type { AuditListFilter } from './repository.ts';
import { allAuditEvents } from './audit-log.ts';
import { auditCsv } from './csv.ts';

export type AuditExportFilter = Omit<AuditListFilter, 'limit' | 'offset'>;

/**
 * Every event matching the filter as CSV, with a file name that says whose log it is and when
 * it was taken. Taking a copy of the log is itself recorded (`audit.exported`), in the same
 * transaction, after the rows are read: the file never contains its own export event.
 */
export async function exportAuditLog(
  org: OrgContext,
  filter: AuditExportFilter,
  now = new Date(),
): Promise<{ filename: string; csv: string }> {
  return org.write(async (tx) => {
    const events = await allAuditEvents(tx, tx.orgId, filter);
    const organization = await findOrganization(tx, tx.orgId);
    await tx.audit({
      action: 'audit.exported',
      targetType: 'organization',
      targetId: tx.orgId,
      details: {
        rows: events.length,
        filter: {
          ...filter,
          from: filter.from?.toISOString(),
          to: filter.to?.toISOString(),
        },
      },
    });
    const day = now.toISOString().slice(0, 10);
    return {
      filename: `audit-${organization?.slug ?? 'organization'}-${day}.csv`,
      csv: auditCsv(events),
    };
  });
}

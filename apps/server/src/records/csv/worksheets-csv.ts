import { worksheetListQuerySchema, type WorksheetListItem } from '@biasproof/shared';
import type { z } from 'zod';
import type { OrgContext } from '../../orgs/org-scope.ts';
import { listWorksheets } from '../../worksheets/repository.ts';
import { toCsv } from './csv.ts';

/** The worksheets list's filters and order, without paging: the export holds every match. */
export const worksheetExportQuerySchema = worksheetListQuerySchema.omit({
  limit: true,
  offset: true,
});
export type WorksheetExportQuery = z.output<typeof worksheetExportQuerySchema>;

const PAGE = 500;

const header = [
  'ID',
  'Title',
  'Description',
  'State',
  'Project code',
  'Project',
  'Revision',
  'Version',
  'Author',
  'Checker',
  'Approver',
  'Results',
  'Created (UTC)',
  'Updated (UTC)',
];

const row = (w: WorksheetListItem) => [
  w.id,
  w.title,
  w.description,
  w.state,
  w.projectCode,
  w.projectName,
  w.revision,
  w.version,
  w.author.name,
  w.checker?.name ?? '',
  w.approver?.name ?? '',
  w.resultStatus,
  w.createdAt,
  w.updatedAt,
];

/** Every worksheet matching the filters, in the list's order, read in one transaction. */
export async function worksheetsCsv(org: OrgContext, query: WorksheetExportQuery): Promise<string> {
  const { assignedToMe, ...filter } = query;
  const items = await org.read(async (tx) => {
    const all: WorksheetListItem[] = [];
    for (let offset = 0; ; offset += PAGE) {
      const page = await listWorksheets(tx, {
        ...filter,
        assignedTo: assignedToMe ? org.actor.userId : undefined,
        limit: PAGE,
        offset,
      });
      all.push(...page.items);
      if (page.items.length < PAGE || all.length >= page.total) return all;
    }
  });
  return toCsv(header, items.map(row));
}

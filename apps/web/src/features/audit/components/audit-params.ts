import type { AuditListQuery } from '@biasproof/shared';

/** The filters of the audit screen, as they are kept in the address. */
export interface AuditFilters {
  from: string;
  to: string;
  actor: string;
  action: string;
  project: string;
  worksheet: string;
}

export const filterKeys = ['from', 'to', 'actor', 'action', 'project', 'worksheet'] as const;
export const AUDIT_PAGE_SIZE = 50;

export function filtersFrom(params: URLSearchParams): AuditFilters {
  const read = (key: keyof AuditFilters) => params.get(key)?.trim() ?? '';
  return {
    from: read('from'),
    to: read('to'),
    actor: read('actor'),
    action: read('action'),
    project: read('project'),
    worksheet: read('worksheet'),
  };
}

export function pageFrom(params: URLSearchParams): number {
  const page = Number(params.get('page'));
  return Number.isInteger(page) && page > 0 ? page : 1;
}

/** The address of a filter choice (empty filters left out; back to page 1). */
export function paramsOf(filters: AuditFilters, page = 1): URLSearchParams {
  const params = new URLSearchParams();
  for (const key of filterKeys) if (filters[key]) params.set(key, filters[key]);
  if (page > 1) params.set('page', String(page));
  return params;
}

/** The API query of a filter choice and page (toQueryString drops the empty values). */
export function queryOf(filters: AuditFilters, page: number): AuditListQuery {
  return { ...filters, limit: AUDIT_PAGE_SIZE, offset: (page - 1) * AUDIT_PAGE_SIZE };
}

import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { worksheetStates, type WorksheetListQuery, type WorksheetState } from '@biasproof/shared';
import type { WorksheetExportQuery } from '@/features/worksheets/api/export-worksheets-csv.ts';

/** Rows per page of the worksheet lists. */
export const PAGE_SIZE = 25;

export type SortColumn = 'title' | 'state' | 'updatedAt';
export type SortDir = 'asc' | 'desc';

/** What the list shows, kept in the address so that back, forward and reload keep it. */
export interface ListParams {
  projectId: string;
  state: WorksheetState | '';
  /** '' anyone, 'me', or a person's id. */
  author: string;
  assignedToMe: boolean;
  q: string;
  sort: SortColumn;
  dir: SortDir;
  page: number;
}

/** A column's first direction when the person sorts by it. */
export const firstDirection: Record<SortColumn, SortDir> = {
  title: 'asc',
  state: 'asc',
  updatedAt: 'desc',
};

const isState = (s: string | null): s is WorksheetState =>
  s !== null && (worksheetStates as readonly string[]).includes(s);
const isSort = (s: string | null): s is SortColumn =>
  s === 'title' || s === 'state' || s === 'updatedAt';

export function useListParams(fixedProjectId?: string) {
  const [search, setSearch] = useSearchParams();
  const params = useMemo<ListParams>(() => {
    const sort = isSort(search.get('sort')) ? (search.get('sort') as SortColumn) : 'updatedAt';
    const dir = search.get('dir');
    const page = Number(search.get('page'));
    const state = search.get('state');
    return {
      projectId: fixedProjectId ?? search.get('project') ?? '',
      state: isState(state) ? state : '',
      author: search.get('author') ?? '',
      assignedToMe: search.get('assigned') === 'me',
      q: search.get('q') ?? '',
      sort,
      dir: dir === 'asc' || dir === 'desc' ? dir : firstDirection[sort],
      page: Number.isInteger(page) && page > 1 ? page : 1,
    };
  }, [search, fixedProjectId]);

  /** Changes some of the list's settings; any change but paging goes back to page 1. */
  const update = useCallback(
    (change: Partial<ListParams>) => {
      const next = { ...params, ...(change.page === undefined ? { page: 1 } : {}), ...change };
      const out = new URLSearchParams();
      if (next.projectId && !fixedProjectId) out.set('project', next.projectId);
      if (next.state) out.set('state', next.state);
      if (next.author) out.set('author', next.author);
      if (next.assignedToMe) out.set('assigned', 'me');
      if (next.q) out.set('q', next.q);
      if (next.sort !== 'updatedAt' || next.dir !== 'desc') {
        out.set('sort', next.sort);
        out.set('dir', next.dir);
      }
      if (next.page > 1) out.set('page', String(next.page));
      setSearch(out, { replace: true });
    },
    [params, setSearch, fixedProjectId],
  );

  return { params, update };
}

/** The list's filters and sort as the API reads them (`me` as author means the signed-in person). */
export function toExportQuery(params: ListParams, userId: string): WorksheetExportQuery {
  return {
    ...(params.projectId ? { projectId: params.projectId } : {}),
    ...(params.state ? { state: params.state } : {}),
    ...(params.author ? { authorId: params.author === 'me' ? userId : params.author } : {}),
    ...(params.assignedToMe ? { assignedToMe: 'true' as const } : {}),
    ...(params.q ? { q: params.q } : {}),
    sort: params.sort,
    dir: params.dir,
  };
}

/** The API query for the page of the list on screen. */
export function toListQuery(params: ListParams, userId: string): WorksheetListQuery {
  return {
    ...toExportQuery(params, userId),
    limit: PAGE_SIZE,
    offset: (params.page - 1) * PAGE_SIZE,
  };
}

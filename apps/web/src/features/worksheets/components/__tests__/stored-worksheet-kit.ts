import { computeWorksheet, ENGINE_VERSION, type WorksheetDraft } from '@biasproof/calc';
import type { z } from 'zod';
import {
  encodeResults,
  type Project,
  type WorksheetListItem,
  type worksheetSchema,
} from '@biasproof/shared';
import { starterDraft } from '@/features/worksheets/draft/starter-draft.ts';

/** Server-side objects of the worksheet tests (ids are uuids, as the schemas want). */

export const projectIds = {
  sensor: '0b7e1c52-6d0f-4c4e-9a53-5f2b7d8e1a01',
  power: '0b7e1c52-6d0f-4c4e-9a53-5f2b7d8e1a02',
};
export const worksheetId = '7c1d2e3f-4a5b-4c6d-8e9f-0a1b2c3d4e5f';

export function aProject(
  overrides: Partial<Project> & Pick<Project, 'id' | 'name' | 'code'>,
): Project {
  return {
    description: '',
    archived: false,
    worksheetCount: 1,
    createdAt: '2026-04-01T09:00:00.000Z',
    updatedAt: '2026-04-01T09:00:00.000Z',
    ...overrides,
  };
}

export const sensorProject = aProject({
  id: projectIds.sensor,
  name: 'Sensor front end',
  code: 'SFE',
});
export const powerProject = aProject({ id: projectIds.power, name: 'Power stage', code: 'PWR' });

export function aListItem(
  overrides: Partial<WorksheetListItem> & Pick<WorksheetListItem, 'id' | 'title'>,
): WorksheetListItem {
  return {
    description: '',
    state: 'draft',
    projectId: projectIds.sensor,
    projectName: 'Sensor front end',
    projectCode: 'SFE',
    revision: 'A',
    version: 1,
    author: { id: 'user-ines', name: 'Ines Okafor' },
    checker: null,
    approver: null,
    resultStatus: 'solved',
    createdAt: '2026-05-01T09:00:00.000Z',
    updatedAt: '2026-05-02T09:00:00.000Z',
    ...overrides,
  };
}

/** A worksheet as it travels (results with non-finite numbers encoded). */
export type WireWorksheet = z.input<typeof worksheetSchema>;

/** A worksheet as the server answers it: the draft with results computed by the engine. */
export function aWorksheet(
  draft: WorksheetDraft = starterDraft(),
  overrides: Partial<WorksheetListItem> = {},
  hash = 'a1'.repeat(32),
): WireWorksheet {
  const item = aListItem({ id: worksheetId, title: 'Input clamp, channel A', ...overrides });
  return {
    ...item,
    currentRevision: {
      letter: item.revision,
      circuit: draft.circuit,
      settings: draft.settings,
      results: encodeResults(computeWorksheet(draft)),
      engineVersion: ENGINE_VERSION,
      contentHash: hash,
      frozen: false,
      createdAt: item.createdAt,
      createdBy: item.author,
    },
  };
}

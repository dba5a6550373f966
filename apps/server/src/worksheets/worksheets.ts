import type { z } from 'zod';
import { defaultAnalysisSettings, emptyCircuit } from '@biasproof/calc';
import type {
  createWorksheetRequestSchema,
  WorksheetListItem,
  worksheetListQuerySchema,
  worksheetSchema,
} from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { OrgContext, OrgTx } from '../orgs/org-scope.ts';
import { computeRevision } from '../calc/compute.ts';
import { findProject } from '../projects/repository.ts';
import { noSuchProject } from '../projects/projects.ts';
import {
  insertRevision,
  insertWorksheet,
  listWorksheets as listWorksheetRows,
  readRevision,
  readWorksheetItem,
  type RevisionRecord,
} from './repository.ts';

/** A worksheet as sent (results encoded, see canonical-json.ts). */
export type WorksheetBody = z.input<typeof worksheetSchema>;

export const noSuchWorksheet = () =>
  new AppError('not-found', 'No such worksheet in this organization');

export async function listWorksheets(
  org: OrgContext,
  query: z.output<typeof worksheetListQuerySchema>,
): Promise<{ items: WorksheetListItem[]; total: number }> {
  const { assignedToMe, ...filter } = query;
  return org.read((tx) =>
    listWorksheetRows(tx, { ...filter, assignedTo: assignedToMe ? org.actor.userId : undefined }),
  );
}

/** The worksheet with its current revision, as the API answers it. */
export async function readWorksheet(tx: OrgTx, id: string): Promise<WorksheetBody> {
  const item = await readWorksheetItem(tx, id);
  const revision = item ? await readRevision(tx, id, item.revision) : null;
  if (!item || !revision) throw noSuchWorksheet();
  return { ...item, currentRevision: revisionBody(revision) };
}

/** A stored revision as the API sends it (results encoded). */
export function revisionBody(revision: RevisionRecord): WorksheetBody['currentRevision'] {
  return {
    letter: revision.letter,
    circuit: revision.circuit as WorksheetBody['currentRevision']['circuit'],
    settings: revision.settings as WorksheetBody['currentRevision']['settings'],
    results: revision.results,
    engineVersion: revision.engine_version,
    contentHash: revision.content_hash,
    frozen: revision.frozen,
    createdAt: new Date(revision.created_at).toISOString(),
    createdBy: { id: revision.created_by_user_id, name: revision.created_by_name },
  };
}

export async function getWorksheet(org: OrgContext, id: string): Promise<WorksheetBody> {
  return org.read((tx) => readWorksheet(tx, id));
}

/** A new draft at revision A, version 1, by the caller; its results are computed at once. */
export async function createWorksheet(
  org: OrgContext,
  input: z.output<typeof createWorksheetRequestSchema>,
): Promise<WorksheetBody> {
  return org.write(async (tx) => {
    const project = await findProject(tx, input.projectId);
    if (!project) throw noSuchProject();
    if (project.archived) {
      throw new AppError('validation-failed', 'Some fields are not valid', {
        projectId: 'This project is archived; restore it before adding worksheets.',
      });
    }
    const computed = computeRevision({
      circuit: input.circuit ?? emptyCircuit(),
      settings: input.settings ?? defaultAnalysisSettings(),
    });
    const worksheet = await insertWorksheet(tx, {
      projectId: project.id,
      title: input.title,
      description: input.description,
      authorUserId: org.actor.userId,
    });
    await insertRevision(tx, {
      worksheetId: worksheet.id,
      letter: worksheet.currentRevision,
      createdByUserId: org.actor.userId,
      ...computed,
    });
    await tx.audit({
      action: 'worksheet.created',
      targetType: 'worksheet',
      targetId: worksheet.id,
      details: {
        projectId: project.id,
        title: worksheet.title,
        revision: worksheet.currentRevision,
        contentHash: computed.contentHash,
        engineVersion: computed.engineVersion,
      },
    });
    return readWorksheet(tx, worksheet.id);
  });
}

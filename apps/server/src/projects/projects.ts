import type { z } from 'zod';
import type {
  createProjectRequestSchema,
  Project,
  projectListQuerySchema,
  updateProjectRequestSchema,
} from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { OrgContext, OrgTx } from '../orgs/org-scope.ts';
import {
  findProject,
  findProjectByCode,
  insertProject,
  listProjects as listProjectRows,
  readProject,
  saveProject,
} from './repository.ts';

export const noSuchProject = () =>
  new AppError('not-found', 'No such project in this organization');

export async function listProjects(
  org: OrgContext,
  query: z.output<typeof projectListQuerySchema>,
): Promise<{ items: Project[]; total: number }> {
  return org.read((tx) => listProjectRows(tx, query));
}

async function readBack(tx: OrgTx, id: string): Promise<Project> {
  const project = await readProject(tx, id);
  if (!project) throw noSuchProject();
  return project;
}

export async function getProject(org: OrgContext, id: string): Promise<Project> {
  return org.read((tx) => readBack(tx, id));
}

async function assertCodeFree(tx: OrgTx, code: string, exceptId?: string): Promise<void> {
  const holder = await findProjectByCode(tx, code);
  if (holder && holder.id !== exceptId) {
    throw new AppError('conflict', `Another project already uses the code ${code}.`, {
      code: `Another project already uses the code ${code}; choose another.`,
    });
  }
}

export async function createProject(
  org: OrgContext,
  input: z.output<typeof createProjectRequestSchema>,
): Promise<Project> {
  return org.write(async (tx) => {
    await assertCodeFree(tx, input.code);
    const row = await insertProject(tx, { ...input, createdByUserId: org.actor.userId });
    await tx.audit({
      action: 'project.created',
      targetType: 'project',
      targetId: row.id,
      details: { name: row.name, code: row.code },
    });
    return readBack(tx, row.id);
  });
}

type ProjectChanges = Partial<Pick<Project, 'name' | 'code' | 'description' | 'archived'>>;

/** The audit action of one update: archiving and restoring get their own names. */
function actionOf(changes: ProjectChanges): string {
  const fields = Object.keys(changes);
  if (fields.length === 1 && changes.archived !== undefined) {
    return changes.archived ? 'project.archived' : 'project.restored';
  }
  return 'project.updated';
}

/** Renames, re-codes, describes, archives or restores a project; one audit event when something changed. */
export async function updateProject(
  org: OrgContext,
  id: string,
  input: z.output<typeof updateProjectRequestSchema>,
): Promise<Project> {
  return org.write(async (tx) => {
    const row = await findProject(tx, id, { lock: true });
    if (!row) throw noSuchProject();
    const changes: ProjectChanges = {};
    const before: ProjectChanges = {};
    for (const field of ['name', 'code', 'description', 'archived'] as const) {
      const value = input[field];
      if (value !== undefined && value !== row[field]) {
        Object.assign(changes, { [field]: value });
        Object.assign(before, { [field]: row[field] });
      }
    }
    if (Object.keys(changes).length === 0) return readBack(tx, id);
    if (changes.code !== undefined) await assertCodeFree(tx, changes.code, id);
    await saveProject(tx, row, changes);
    await tx.audit({
      action: actionOf(changes),
      targetType: 'project',
      targetId: id,
      details: { before, after: changes },
    });
    return readBack(tx, id);
  });
}

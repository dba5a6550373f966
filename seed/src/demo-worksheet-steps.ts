// Demo steps for the model library and the projects with their worksheets. They go through
// the server's use cases as the demo people (so every change is checked by the same rules and
// audited like a change made in the app), and find what exists by its natural key (model
// name, project code, worksheet title within its project), so loading twice changes nothing.
import type { Sequelize } from 'sequelize';
import { analysisSettingsSchema, parseDeck } from '@biasproof/calc';
import {
  createModelRequestSchema,
  createWorksheetRequestSchema,
  updateWorksheetRequestSchema,
} from '@biasproof/shared';
import { inTransaction } from '../../apps/server/src/db/transactions.ts';
import { findAccountByEmail } from '../../apps/server/src/auth/accounts.ts';
import { activeRolesIn, findOrganizationBySlug } from '../../apps/server/src/orgs/repository.ts';
import { createOrgContext, type OrgContext } from '../../apps/server/src/orgs/org-scope.ts';
import { createModel } from '../../apps/server/src/models/model-library.ts';
import { findEntryByName } from '../../apps/server/src/models/repository.ts';
import { createProject } from '../../apps/server/src/projects/projects.ts';
import { findProjectByCode } from '../../apps/server/src/projects/repository.ts';
import { createWorksheet } from '../../apps/server/src/worksheets/worksheets.ts';
import { updateWorksheet } from '../../apps/server/src/worksheets/update-worksheet.ts';
import type { DemoStep } from './demo-steps.ts';
import {
  DEMO_ORG_SLUG,
  demoModels,
  demoProjects,
  type DemoProject,
  type DemoWorksheet,
} from './demo-worksheets.ts';

export interface DemoOrg {
  id: string;
  /** The org context of a demo person, acting with their roles. */
  as(email: string): OrgContext;
  userId(email: string): string;
}

export async function demoOrg(sequelize: Sequelize): Promise<DemoOrg> {
  const emails = new Set([
    ...demoModels.map((m) => m.createdBy),
    ...demoProjects.flatMap((p) => [
      p.createdBy,
      ...p.worksheets.flatMap((w) => [w.author, w.checker, w.approver]),
    ]),
  ]);
  return inTransaction(sequelize, 'system', async (tx) => {
    const org = await findOrganizationBySlug(tx, DEMO_ORG_SLUG);
    if (!org) throw new Error(`the organization ${DEMO_ORG_SLUG} must be loaded first`);
    const people = new Map<string, { userId: string; context: OrgContext }>();
    for (const email of emails) {
      if (!email) continue;
      const account = await findAccountByEmail(tx, email);
      const roles = account ? await activeRolesIn(tx, org.id, account.id) : null;
      if (!account || !roles) throw new Error(`${email} must be a member of ${DEMO_ORG_SLUG}`);
      const context = createOrgContext(sequelize, org.id, { userId: account.id, roles });
      people.set(email, { userId: account.id, context });
    }
    const person = (email: string) => {
      const found = people.get(email);
      if (!found) throw new Error(`${email} is not a demo person of ${DEMO_ORG_SLUG}`);
      return found;
    };
    return {
      id: org.id,
      as: (email) => person(email).context,
      userId: (email) => person(email).userId,
    };
  });
}

/** A handful of device models, as an author would enter them. */
export const modelLibrary: DemoStep = {
  name: 'model library',
  async load(sequelize) {
    const org = await demoOrg(sequelize);
    let loaded = false;
    for (const model of demoModels) {
      const as = org.as(model.createdBy);
      if (await as.read((tx) => findEntryByName(tx, model.name))) continue;
      await createModel(as, createModelRequestSchema.parse(model));
      loaded = true;
    }
    return { loaded, signIns: [] };
  },
};

/** The worksheet's circuit and settings from its deck; a demo deck must read without warnings. */
function draftOf(worksheet: DemoWorksheet) {
  const { circuit, directives, warnings } = parseDeck(worksheet.deck);
  if (warnings.length > 0) {
    throw new Error(
      `demo deck of "${worksheet.title}": ${warnings.map((w) => w.message).join('; ')}`,
    );
  }
  const settings = analysisSettingsSchema.parse({
    ...(directives.temperature !== undefined ? { temperature: directives.temperature } : {}),
    ...(directives.ac ? { sweep: directives.ac } : {}),
    ...worksheet.settings,
  });
  return { circuit, settings };
}

async function ensureProject(org: DemoOrg, project: DemoProject) {
  const as = org.as(project.createdBy);
  const existing = await as.read((tx) => findProjectByCode(tx, project.code));
  if (existing) return { id: existing.id, created: false };
  const { code, name, description } = project;
  const created = await createProject(as, { code, name, description });
  return { id: created.id, created: true };
}

async function ensureWorksheet(org: DemoOrg, projectId: string, worksheet: DemoWorksheet) {
  const as = org.as(worksheet.author);
  const existing = await as.read((tx) =>
    tx.models.Worksheet.findOne({
      where: { orgId: tx.orgId, projectId, title: worksheet.title },
      transaction: tx.transaction,
    }),
  );
  if (existing) return false;
  const created = await createWorksheet(
    as,
    createWorksheetRequestSchema.parse({
      projectId,
      title: worksheet.title,
      description: worksheet.description,
      ...draftOf(worksheet),
    }),
  );
  if (worksheet.checker || worksheet.approver) {
    await updateWorksheet(
      as,
      created.id,
      updateWorksheetRequestSchema.parse({
        version: created.version,
        ...(worksheet.checker ? { checkerId: org.userId(worksheet.checker) } : {}),
        ...(worksheet.approver ? { approverId: org.userId(worksheet.approver) } : {}),
      }),
    );
  }
  return true;
}

/** Two projects and their worksheets, each computed by the engine as it is saved. */
export const projectsAndWorksheets: DemoStep = {
  name: 'projects and worksheets',
  async load(sequelize) {
    const org = await demoOrg(sequelize);
    let loaded = false;
    for (const project of demoProjects) {
      const { id, created } = await ensureProject(org, project);
      loaded ||= created;
      for (const worksheet of project.worksheets) {
        loaded = (await ensureWorksheet(org, id, worksheet)) || loaded;
      }
    }
    return { loaded, signIns: [] };
  },
};

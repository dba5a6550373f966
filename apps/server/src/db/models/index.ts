import type { Sequelize } from 'sequelize';
import { defineOrganization } from './organization.ts';
import { defineUser } from './user.ts';
import { defineMembership } from './membership.ts';
import { defineInvitation } from './invitation.ts';
import { definePasswordReset } from './password-reset.ts';
import { defineAuditEvent } from './audit-event.ts';
import { defineProject } from './project.ts';
import { defineWorksheet } from './worksheet.ts';
import { defineRevision } from './revision.ts';
import { defineModelLibraryEntry } from './model-library-entry.ts';

function defineModels(sequelize: Sequelize) {
  return {
    Organization: defineOrganization(sequelize),
    User: defineUser(sequelize),
    Membership: defineMembership(sequelize),
    Invitation: defineInvitation(sequelize),
    PasswordReset: definePasswordReset(sequelize),
    AuditEvent: defineAuditEvent(sequelize),
    Project: defineProject(sequelize),
    Worksheet: defineWorksheet(sequelize),
    Revision: defineRevision(sequelize),
    ModelLibraryEntry: defineModelLibraryEntry(sequelize),
  };
}

export type Models = ReturnType<typeof defineModels>;

const cache = new WeakMap<Sequelize, Models>();

/**
 * The models bound to one Sequelize instance. Models are defined per instance (not as global
 * classes) so that several apps over different databases can live in one process, as in tests.
 */
export function modelsFor(sequelize: Sequelize): Models {
  let models = cache.get(sequelize);
  if (!models) {
    models = defineModels(sequelize);
    cache.set(sequelize, models);
  }
  return models;
}

import type { Sequelize } from 'sequelize';
import type { AppConfig } from '../../apps/server/src/config.ts';
import { createPasswordHasher } from '../../apps/server/src/auth/passwords.ts';
import {
  ensureAccount,
  ensureMembership,
  ensureOrganization,
} from '../../apps/server/src/orgs/provisioning.ts';
import { createOrgContext } from '../../apps/server/src/orgs/org-scope.ts';
import { createInvitation } from '../../apps/server/src/invitations/repository.ts';
import { INVITATION_TTL_MS } from '../../apps/server/src/invitations/invitations.ts';
import { newLinkToken } from '../../apps/server/src/auth/tokens.ts';
import { findAccountByEmail } from '../../apps/server/src/auth/accounts.ts';
import { findOrganizationBySlug } from '../../apps/server/src/orgs/repository.ts';
import { inTransaction } from '../../apps/server/src/db/transactions.ts';
import { DEMO_PASSWORD, demoOrganizations } from './demo-organizations.ts';
import { modelLibrary, projectsAndWorksheets } from './demo-worksheet-steps.ts';
import { reviewHistory } from './demo-review-steps.ts';

export interface DemoStepResult {
  /** True when this run wrote the step's data (false when it was already there). */
  loaded: boolean;
  /** Lines describing demo sign-ins to print, e.g. `ada@… (author) — password …`. */
  signIns: string[];
}

export interface DemoStep {
  name: string;
  load(sequelize: Sequelize, config: AppConfig): Promise<DemoStepResult>;
}

/** Organizations, people and memberships; every account gets the shared demo password. */
const organizationsAndPeople: DemoStep = {
  name: 'organizations and people',
  async load(sequelize, config) {
    const passwords = createPasswordHasher(config.argon2);
    let loaded = false;
    const rolesByEmail = new Map<string, string[]>();
    for (const org of demoOrganizations) {
      const { id: orgId, created } = await ensureOrganization(sequelize, {
        slug: org.slug,
        name: org.name,
        timezone: org.timezone,
      });
      loaded ||= created;
      for (const { person, roles } of org.members) {
        const account = await ensureAccount(sequelize, passwords, {
          ...person,
          password: DEMO_PASSWORD,
        });
        const membership = await ensureMembership(sequelize, orgId, account.id, roles);
        loaded ||= account.created || membership.created;
        rolesByEmail.set(person.email, [
          ...(rolesByEmail.get(person.email) ?? []),
          `${org.name}: ${roles.join(', ')}`,
        ]);
      }
    }
    const signIns = [...rolesByEmail].map(
      ([email, where]) => `${email} (${where.join('; ')}) — password ${DEMO_PASSWORD}`,
    );
    return { loaded, signIns };
  },
};

/** A pending invitation, so the invitations screen is not empty; created by the organization's first admin. */
const pendingInvitations: DemoStep = {
  name: 'pending invitations',
  async load(sequelize) {
    let loaded = false;
    for (const org of demoOrganizations) {
      if (!org.pendingInvitations.length) continue;
      const admin = org.members.find((m) => m.roles.includes('admin'));
      if (!admin) continue;
      const { orgId, adminId } = await inTransaction(sequelize, 'system', async (tx) => {
        const orgRow = await findOrganizationBySlug(tx, org.slug);
        const adminRow = await findAccountByEmail(tx, admin.person.email);
        if (!orgRow || !adminRow) throw new Error(`the people of ${org.slug} must be loaded first`);
        return { orgId: orgRow.id, adminId: adminRow.id };
      });
      const context = createOrgContext(sequelize, orgId, { userId: adminId, roles: admin.roles });
      for (const invitation of org.pendingInvitations) {
        const created = await context.write(async (tx) => {
          const existing = await tx.models.Invitation.findOne({
            where: { orgId: tx.orgId, email: invitation.email },
            transaction: tx.transaction,
          });
          if (existing) return false;
          const row = await createInvitation(tx, {
            ...invitation,
            tokenHash: newLinkToken().tokenHash,
            invitedByUserId: adminId,
            expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
          });
          await tx.audit({
            action: 'invitation.created',
            targetType: 'invitation',
            targetId: row.id,
            details: { email: invitation.email, roles: invitation.roles },
          });
          return true;
        });
        loaded ||= created;
      }
    }
    return { loaded, signIns: [] };
  },
};

/**
 * The demo scenario, in load order. Each step finds what is already there and adds only
 * what is missing, so loading twice changes nothing.
 */
export const demoSteps: DemoStep[] = [
  organizationsAndPeople,
  pendingInvitations,
  modelLibrary,
  projectsAndWorksheets,
  reviewHistory,
];

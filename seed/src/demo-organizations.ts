// The demo's organizations and people: invented, with reserved `.example` domains. Quietline
// Analog has every role held by a different person (two authors); Lowdrift Sensors is small,
// and Tomas Lindqvist belongs to both so the organization switcher has something to switch.
import type { Role } from '@biasproof/shared';

/** For local use only: every demo account signs in with it. */
export const DEMO_PASSWORD = 'quiescent-demo-2026';

export interface DemoPerson {
  email: string;
  name: string;
}

export interface DemoOrganization {
  slug: string;
  name: string;
  timezone: string;
  members: { person: DemoPerson; roles: Role[] }[];
  /** Invitations waiting for an answer (their links are not known; an admin can resend one). */
  pendingInvitations: { email: string; roles: Role[] }[];
}

const people = {
  ines: { email: 'ines.varga@quietline.example', name: 'Ines Varga' },
  tomas: { email: 'tomas.lindqvist@quietline.example', name: 'Tomas Lindqvist' },
  priya: { email: 'priya.raman@quietline.example', name: 'Priya Raman' },
  kofi: { email: 'kofi.mensah@quietline.example', name: 'Kofi Mensah' },
  elena: { email: 'elena.sorokina@quietline.example', name: 'Elena Sorokina' },
  marc: { email: 'marc.dubois@quietline.example', name: 'Marc Dubois' },
  hana: { email: 'hana.sato@lowdrift.example', name: 'Hana Sato' },
  olu: { email: 'olu.adeyemi@lowdrift.example', name: 'Olu Adeyemi' },
} satisfies Record<string, DemoPerson>;

export const demoOrganizations: DemoOrganization[] = [
  {
    slug: 'quietline-analog',
    name: 'Quietline Analog',
    timezone: 'Europe/Berlin',
    members: [
      { person: people.ines, roles: ['admin'] },
      { person: people.tomas, roles: ['author'] },
      { person: people.priya, roles: ['author'] },
      { person: people.kofi, roles: ['checker'] },
      { person: people.elena, roles: ['approver'] },
      { person: people.marc, roles: ['manager'] },
    ],
    pendingInvitations: [{ email: 'nadia.okoro@quietline.example', roles: ['checker'] }],
  },
  {
    slug: 'lowdrift-sensors',
    name: 'Lowdrift Sensors',
    timezone: 'America/Toronto',
    members: [
      { person: people.hana, roles: ['admin', 'manager'] },
      { person: people.olu, roles: ['author'] },
      { person: people.tomas, roles: ['checker', 'approver'] },
    ],
    pendingInvitations: [],
  },
];

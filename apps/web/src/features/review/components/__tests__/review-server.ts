import {
  computeWorksheet,
  defaultAnalysisSettings,
  ENGINE_VERSION,
  type WorksheetDraft,
} from '@biasproof/calc';
import type { z } from 'zod';
import {
  availableActions,
  createFindingRequestSchema,
  decideTransition,
  encodeResults,
  transitionRequestSchema,
  type Attachment,
  type Finding,
  type Role,
  type Signature,
  type WorksheetListItem,
  type worksheetSchema,
  type WorksheetState,
} from '@biasproof/shared';
import { aMember, apiError, list, meOf, orgs, stubApi, type FakeRoutes } from '@/test/fake-api.ts';

/** The review's tests: one worksheet of Resonant Labs and the four people around it. */

export const people = {
  author: { id: 'user-ines', name: 'Ines Okafor' },
  checker: { id: 'user-tomas', name: 'Tomas Lindqvist' },
  approver: { id: 'user-priya', name: 'Priya Raman' },
  manager: { id: 'user-kofi', name: 'Kofi Mensah' },
};
export type Person = keyof typeof people;
const rolesOf: Record<Person, Role[]> = {
  author: ['author'],
  checker: ['checker'],
  approver: ['approver'],
  manager: ['manager'],
};

export const worksheetId = '5e0c7a1d-2b3c-4d5e-8f90-a1b2c3d4e5f6';
export const worksheetPath = `/o/resonant-labs/worksheets/${worksheetId}`;
export const RIGHT_PASSWORD = 'collector-load-4417';
const base = `/api/orgs/org-resonant`;
const hashOf = (letter: string) => (letter === 'A' ? 'a1' : 'b2').repeat(32);

/** A diode from 5 V through 1 kΩ (example values only). */
export function diodeDraft(): WorksheetDraft {
  return {
    circuit: {
      title: 'Diode bias network',
      elements: [
        { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 5 },
        { kind: 'R', name: 'R1', nodes: ['in', 'out'], value: 1000 },
        { kind: 'D', name: 'D1', nodes: ['out', '0'], model: 'DSIG', area: 1 },
      ],
      models: [{ name: 'DSIG', kind: 'D', params: { IS: 1e-14, N: 1 } }],
    },
    settings: { ...defaultAnalysisSettings(), inputSource: 'V1', outputNode: 'out' },
  };
}

interface ServerOptions {
  as: Person;
  state: WorksheetState;
  revision?: string;
  findings?: Finding[];
  signatures?: Signature[];
  checker?: { id: string; name: string } | null;
  /** Who watches the worksheet (receives its signed e-mail). */
  watchers?: { id: string; name: string }[];
  /** Overrides a route (e.g. a stale version once). */
  routes?: FakeRoutes;
}

export function aFinding(overrides: Partial<Finding> & Pick<Finding, 'id'>): Finding {
  return {
    worksheetId,
    revision: 'A',
    path: 'devices.d1.id',
    severity: 'major',
    text: 'The diode current is above the part’s continuous rating.',
    status: 'open',
    createdBy: people.checker,
    createdAt: '2026-11-30T10:00:00.000Z',
    updatedAt: '2026-11-30T10:00:00.000Z',
    replies: [],
    carried: false,
    pinnedValue: 4.3e-3,
    currentValue: 4.3e-3,
    valueChanged: false,
    ...overrides,
  };
}

/**
 * A stateful fake of the review API: the workflow decisions are the shared rules the server
 * uses (decideTransition), so the buttons shown and the answers given agree with them.
 */
export function reviewServer({
  as,
  state,
  revision = 'A',
  findings: startFindings = [],
  signatures: startSignatures = [],
  checker = people.checker,
  watchers: startWatchers = [],
  routes = {},
}: ServerOptions) {
  const me = people[as];
  const roles = rolesOf[as];
  const s = {
    state,
    revision,
    version: 3,
    checkedById: state === 'checked' ? people.checker.id : null,
    checker,
    findings: [...startFindings],
    signatures: [...startSignatures],
    attachments: [] as Attachment[],
    watchers: [...startWatchers],
  };
  const watchersAnswer = () => ({
    status: 200,
    body: { watching: s.watchers.some((w) => w.id === me.id), watchers: s.watchers },
  });
  const openMajor = () =>
    s.findings.filter((f) => f.severity === 'major' && f.status !== 'closed').length;
  const view = () => ({
    state: s.state,
    authorId: people.author.id,
    checkerId: s.checker?.id ?? null,
    approverId: people.approver.id,
    checkedById: s.checkedById,
  });
  const item = (): WorksheetListItem => ({
    id: worksheetId,
    title: 'Input clamp, channel A',
    description: '',
    state: s.state,
    projectId: 'project-sfe',
    projectName: 'Sensor front end',
    projectCode: 'SFE',
    revision: s.revision,
    version: s.version,
    author: people.author,
    checker: s.checker,
    approver: people.approver,
    resultStatus: 'solved',
    createdAt: '2026-11-28T09:00:00.000Z',
    updatedAt: '2026-11-30T09:00:00.000Z',
  });
  const worksheet = (): z.input<typeof worksheetSchema> => {
    const draft = diodeDraft();
    return {
      ...item(),
      currentRevision: {
        letter: s.revision,
        circuit: draft.circuit,
        settings: draft.settings,
        results: encodeResults(computeWorksheet(draft)),
        engineVersion: ENGINE_VERSION,
        contentHash: hashOf(s.revision),
        frozen: s.state !== 'draft' && s.state !== 'returned',
        createdAt: '2026-11-28T09:00:00.000Z',
        createdBy: people.author,
      },
    };
  };
  const findingRoute =
    (move: (f: Finding, text: string) => Finding | null): FakeRoutes[string] =>
    ({ params, body }) => {
      const found = s.findings.find((f) => f.id === params.findingId);
      if (!found) return apiError(404, 'not-found', 'No such finding.');
      const text = (body as { text?: string }).text ?? '';
      const moved = move(found, text);
      if (!moved) return apiError(409, 'invalid-transition', 'Not from this status.');
      s.findings = s.findings.map((f) => (f.id === found.id ? moved : f));
      return { status: 200, body: moved };
    };
  const reply = (kind: Finding['replies'][number]['kind'], text: string) => ({
    id: `reply-${Math.random().toString(16).slice(2)}`,
    kind,
    text,
    by: me,
    at: '2026-12-01T08:00:00.000Z',
  });

  const api: ReturnType<typeof stubApi> = stubApi({
    'GET /api/auth/me': () => ({ status: 200, body: meOf(me, [{ ...orgs.resonant, roles }]) }),
    'GET /api/orgs/org-resonant': () => ({
      status: 200,
      body: {
        id: 'org-resonant',
        slug: 'resonant-labs',
        name: 'Resonant Labs',
        timezone: 'Europe/Berlin',
      },
    }),
    'GET /api/orgs/org-resonant/models': () => ({ status: 200, body: list([]) }),
    'GET /api/orgs/org-resonant/members': () => ({
      status: 200,
      body: list(
        (Object.keys(people) as Person[]).map((p) =>
          aMember({ userId: people[p].id, name: people[p].name, roles: rolesOf[p] }),
        ),
      ),
    }),
    [`PATCH ${base}/worksheets/:id`]: ({ body }) => {
      const input = body as { version: number; checkerId?: string | null };
      if (input.version !== s.version)
        return apiError(409, 'stale-version', 'Saved by someone else.');
      if (input.checkerId !== undefined) {
        s.checker = Object.values(people).find((p) => p.id === input.checkerId) ?? null;
      }
      s.version += 1;
      return { status: 200, body: worksheet() };
    },
    [`GET ${base}/worksheets/:id`]: () => ({ status: 200, body: worksheet() }),
    [`GET ${base}/worksheets/:id/actions`]: () => {
      const verdicts = availableActions(view(), me.id, roles, openMajor());
      return {
        status: 200,
        body: {
          items: verdicts.map((d) =>
            d.allowed
              ? { action: d.action, allowed: true, from: d.from, to: d.to }
              : { action: d.action, allowed: false, from: d.from, code: d.code, reason: d.reason },
          ),
          openMajorFindings: openMajor(),
          signatureMeanings: ['Reviewed', 'Approved for release'],
        },
      };
    },
    [`POST ${base}/worksheets/:id/transitions`]: ({ body }) => {
      const input = transitionRequestSchema.parse(body);
      if (input.version !== s.version) {
        return apiError(409, 'stale-version', 'Saved by someone else.', {
          version: String(s.version),
        });
      }
      const decision = decideTransition(
        input.action,
        view(),
        { userId: me.id, roles },
        openMajor(),
      );
      if (!decision.allowed) {
        return apiError(decision.code === 'forbidden' ? 403 : 409, decision.code, decision.reason);
      }
      if (input.action === 'sign') {
        if (input.password !== RIGHT_PASSWORD) {
          return apiError(403, 'bad-password', 'That is not your password; nothing was signed.');
        }
        s.signatures.push({
          id: `sig-${s.signatures.length + 1}`,
          revision: s.revision,
          signer: me,
          printedName: me.name,
          meaning: input.meaning ?? '',
          contentHash: hashOf(s.revision),
          signedAt: '2026-12-01T13:05:00.000Z',
          supersededAt: null,
        });
      }
      if (input.action === 'accept') s.checkedById = me.id;
      if (input.action === 'revise') s.revision = String.fromCharCode(s.revision.charCodeAt(0) + 1);
      s.state = decision.to;
      s.version += 1;
      return { status: 200, body: worksheet() };
    },
    [`GET ${base}/worksheets/:id/findings`]: () => ({ status: 200, body: list(s.findings) }),
    [`POST ${base}/worksheets/:id/findings`]: ({ body }) => {
      const input = createFindingRequestSchema.parse(body);
      const finding = aFinding({
        id: `finding-${s.findings.length + 1}`,
        ...input,
        revision: s.revision,
        createdBy: me,
      });
      s.findings.push(finding);
      return { status: 201, body: finding };
    },
    [`POST ${base}/findings/:findingId/answer`]: findingRoute((f, text) =>
      f.status === 'open'
        ? { ...f, status: 'answered', replies: [...f.replies, reply('answer', text)] }
        : null,
    ),
    [`POST ${base}/findings/:findingId/close`]: findingRoute((f, text) =>
      f.status === 'closed'
        ? null
        : { ...f, status: 'closed', replies: [...f.replies, reply('close', text)] },
    ),
    [`POST ${base}/findings/:findingId/reopen`]: findingRoute((f, text) =>
      f.status === 'open'
        ? null
        : { ...f, status: 'open', replies: [...f.replies, reply('reopen', text)] },
    ),
    [`POST ${base}/findings/:findingId/replies`]: findingRoute((f, text) => ({
      ...f,
      replies: [...f.replies, reply('reply', text)],
    })),
    [`GET ${base}/worksheets/:id/signatures`]: () => ({ status: 200, body: list(s.signatures) }),
    [`GET ${base}/worksheets/:id/watchers`]: watchersAnswer,
    [`PUT ${base}/worksheets/:id/watchers/me`]: () => {
      if (!s.watchers.some((w) => w.id === me.id)) s.watchers.push(me);
      return watchersAnswer();
    },
    [`DELETE ${base}/worksheets/:id/watchers/me`]: () => {
      s.watchers = s.watchers.filter((w) => w.id !== me.id);
      return watchersAnswer();
    },
    [`GET ${base}/worksheets/:id/attachments`]: () => ({ status: 200, body: list(s.attachments) }),
    [`POST ${base}/worksheets/:id/attachments`]: () => {
      // The multipart body is the FormData the page handed to fetch.
      const form = api.fetchMock.mock.lastCall?.[1]?.body as FormData;
      const file = form.get('file') as File;
      if (file.name.endsWith('.svg')) {
        return apiError(
          400,
          'unsupported-type',
          `${file.name} is an SVG image; attach PDF, PNG, JPEG, CSV or a SPICE deck.`,
        );
      }
      const findingId = form.get('findingId');
      const attachment: Attachment = {
        id: `att-${s.attachments.length + 1}`,
        worksheetId,
        findingId: typeof findingId === 'string' ? findingId : null,
        revision: s.revision,
        filename: file.name,
        type: 'pdf',
        contentType: 'application/pdf',
        size: file.size,
        sha256: 'c3'.repeat(32),
        uploadedBy: me,
        uploadedAt: '2026-12-01T09:00:00.000Z',
      };
      s.attachments.push(attachment);
      return { status: 201, body: attachment };
    },
    ...routes,
  });
  return { api, state: s };
}

// The review history of the demo: worksheets walked through the workflow by the demo people,
// through the server's own use cases (so every step is checked, audited in the hash chain and
// e-mailed like a step taken in the app). Together with the untouched drafts they leave a
// worksheet in every state: in check, checked, returned (with an open major finding and a
// reply), signed off (with an earlier revision superseded) and withdrawn. A script runs only on
// a worksheet still at its first draft, so loading twice changes nothing.
import type { Sequelize } from 'sequelize';
import { circuitSchema, type Circuit } from '@biasproof/calc';
import {
  createFindingRequestSchema,
  updateWorksheetRequestSchema,
  type CreateFindingRequest,
  type WorkflowAction,
} from '@biasproof/shared';
import type { AppConfig } from '../../apps/server/src/config.ts';
import { createPasswordHasher } from '../../apps/server/src/auth/passwords.ts';
import { transitionWorksheet } from '../../apps/server/src/review/transitions.ts';
import { moveFinding, raiseFinding } from '../../apps/server/src/review/findings.ts';
import { replyToFinding } from '../../apps/server/src/review/finding-replies.ts';
import { getWorksheet } from '../../apps/server/src/worksheets/worksheets.ts';
import { updateWorksheet } from '../../apps/server/src/worksheets/update-worksheet.ts';
import type { DemoStep } from './demo-steps.ts';
import { DEMO_PASSWORD } from './demo-organizations.ts';
import { demoOrg, type DemoOrg } from './demo-worksheet-steps.ts';
import { demoProjects } from './demo-worksheets.ts';

const tomas = 'tomas.lindqvist@quietline.example';
const priya = 'priya.raman@quietline.example';
const kofi = 'kofi.mensah@quietline.example';
const elena = 'elena.sorokina@quietline.example';

/** What one demo person does to one worksheet, in order. */
type Move =
  | { by: string; step: WorkflowAction; comment?: string; meaning?: string }
  | { by: string; raise: CreateFindingRequest; as: string }
  | { by: string; answer: string; finding: string }
  | { by: string; reply: string; finding: string }
  | { by: string; close: string; finding: string }
  | { by: string; edit: { element: string; value: number } };

interface ReviewScript {
  title: string;
  moves: Move[];
}

const scripts: ReviewScript[] = [
  {
    // Signed at A, revised and signed again at B: A is superseded.
    title: 'Preamp bias reference (two-diode string)',
    moves: [
      { by: tomas, step: 'submit' },
      {
        by: kofi,
        as: 'ripple',
        raise: {
          path: 'nodes.ref',
          severity: 'note',
          text: 'Reference sits at about 1.2 V as intended; rail ripple reaching it is small enough for the preamp.',
        },
      },
      { by: kofi, close: 'Nothing to change.', finding: 'ripple' },
      { by: kofi, step: 'accept' },
      { by: elena, step: 'sign', meaning: 'Reviewed' },
      { by: tomas, step: 'revise' },
      { by: tomas, edit: { element: 'R1', value: 8200 } },
      { by: tomas, step: 'submit', comment: 'R1 lowered to 8.2 kΩ for more reference current.' },
      { by: kofi, step: 'accept' },
      { by: elena, step: 'sign', meaning: 'Approved for release' },
    ],
  },
  {
    // Returned with a major finding, answered and revised (B), closed and accepted: awaits sign-off.
    title: 'Preamp first stage (NPN common-emitter)',
    moves: [
      { by: tomas, step: 'submit' },
      {
        by: kofi,
        as: 'current',
        raise: {
          path: 'devices.q1.ic',
          severity: 'major',
          text: 'Collector current is above the 1 mA the noise budget assumes; lower it or update the budget.',
        },
      },
      { by: kofi, step: 'return', comment: 'One major finding on the bias current.' },
      { by: tomas, answer: 'R1 raised to 56 kΩ; IC now near 1 mA.', finding: 'current' },
      { by: tomas, edit: { element: 'R1', value: 56000 } },
      { by: tomas, step: 'submit' },
      { by: kofi, close: 'Checked at revision B.', finding: 'current' },
      { by: kofi, step: 'accept' },
    ],
  },
  {
    // In check with an open minor finding: waits for the checker.
    title: 'Bridge amplifier input (NMOS common-source)',
    moves: [
      { by: priya, step: 'submit' },
      {
        by: kofi,
        as: 'gain',
        raise: {
          path: 'gain.vv',
          severity: 'minor',
          text: 'Say in the description which load the gain assumes.',
        },
      },
    ],
  },
  {
    // Returned with an open major finding and the author's reply: the transistor saturates.
    title: 'Excitation monitor gain stage (NPN common-emitter)',
    moves: [
      { by: priya, step: 'submit' },
      {
        by: kofi,
        as: 'saturation',
        raise: {
          path: 'devices.q1.vce',
          severity: 'major',
          text: 'Q1 is saturated: the stiff 10 kΩ / 22 kΩ divider puts the base far too high for this RC and RE.',
        },
      },
      { by: kofi, step: 'return', comment: 'Q1 saturates; see the finding.' },
      {
        by: priya,
        reply: 'Agreed; I will re-derive the divider for VCE near 6 V.',
        finding: 'saturation',
      },
    ],
  },
  {
    // Withdrawn by its author before review.
    title: 'Preamp second stage (PNP common-emitter)',
    moves: [
      {
        by: priya,
        step: 'withdraw',
        comment: 'Replaced by a line driver with its own bias; kept for reference.',
      },
    ],
  },
];

function withElementValue(circuit: Circuit, name: string, value: number): Circuit {
  if (!circuit.elements.some((e) => e.name === name)) {
    throw new Error(`demo review: no element ${name}`);
  }
  return {
    ...circuit,
    elements: circuit.elements.map((e) => (e.name === name ? { ...e, value } : e)),
  };
}

async function findWorksheetId(org: DemoOrg, title: string): Promise<string | null> {
  const author = demoProjects.flatMap((p) => p.worksheets).find((w) => w.title === title)?.author;
  if (!author) throw new Error(`demo review: no demo worksheet "${title}"`);
  const row = await org.as(author).read((tx) =>
    tx.models.Worksheet.findOne({
      where: { orgId: tx.orgId, title },
      transaction: tx.transaction,
    }),
  );
  return row?.id ?? null;
}

async function play(
  org: DemoOrg,
  svc: Parameters<typeof transitionWorksheet>[1],
  worksheetId: string,
  moves: Move[],
): Promise<void> {
  const findings = new Map<string, string>();
  const findingId = (key: string) => {
    const id = findings.get(key);
    if (!id) throw new Error(`demo review: finding ${key} is raised later`);
    return id;
  };
  const appUrl = svc.config.appUrl;
  for (const move of moves) {
    const as = org.as(move.by);
    if ('step' in move) {
      const { version } = await getWorksheet(as, worksheetId);
      const sign = move.step === 'sign' ? { meaning: move.meaning, password: DEMO_PASSWORD } : {};
      await transitionWorksheet(as, svc, worksheetId, {
        action: move.step,
        version,
        ...(move.comment ? { comment: move.comment } : {}),
        ...sign,
      });
    } else if ('raise' in move) {
      const input = createFindingRequestSchema.parse(move.raise);
      findings.set(move.as, (await raiseFinding(as, appUrl, worksheetId, input)).id);
    } else if ('answer' in move) {
      await moveFinding(as, appUrl, findingId(move.finding), 'answer', move.answer);
    } else if ('close' in move) {
      await moveFinding(as, appUrl, findingId(move.finding), 'close', move.close);
    } else if ('reply' in move) {
      await replyToFinding(as, appUrl, findingId(move.finding), move.reply);
    } else {
      const current = await getWorksheet(as, worksheetId);
      const circuit = withElementValue(
        circuitSchema.parse(current.currentRevision.circuit),
        move.edit.element,
        move.edit.value,
      );
      await updateWorksheet(
        as,
        worksheetId,
        updateWorksheetRequestSchema.parse({ version: current.version, circuit }),
      );
    }
  }
}

/** Worksheets in every review state, with findings, replies, signatures and their audit trail. */
export const reviewHistory: DemoStep = {
  name: 'review history',
  async load(sequelize: Sequelize, config: AppConfig) {
    const org = await demoOrg(sequelize);
    const svc = { config, passwords: createPasswordHasher(config.argon2) };
    let loaded = false;
    for (const script of scripts) {
      const id = await findWorksheetId(org, script.title);
      if (!id) throw new Error(`demo review: "${script.title}" must be loaded first`);
      const worksheet = await getWorksheet(org.as(tomas), id);
      if (worksheet.state !== 'draft' || worksheet.revision !== 'A') continue;
      await play(org, svc, id, script.moves);
      loaded = true;
    }
    return { loaded, signIns: [] };
  },
};

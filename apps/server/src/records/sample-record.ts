import { analysisSettingsSchema, parseDeck, type WorksheetDraft } from '@biasproof/calc';
import { decodeResults, type Signature } from '@biasproof/shared';
import { computeRevision } from '../calc/compute.ts';
import type { RecordData, RecordFinding } from './record-data.ts';

/**
 * An invented record for the report benchmark and the renderer's own checks: a chain of
 * common-emitter stages with an indicator diode, findings with threads, signatures and audit
 * events, built in memory without a database.
 */

/** A deck of `stages` capacitively coupled common-emitter stages, each with its own indicator diode. */
export function amplifierDeck(stages: number): string {
  const lines = ['Common-emitter chain', 'VCC vcc 0 DC 12', 'VIN in 0 DC 0 AC 1', 'RS in s0 600'];
  for (let k = 1; k <= stages; k++) {
    const from = `s${k - 1}`;
    lines.push(
      `C${k}1 ${from} b${k} 10u`,
      `R${k}1 vcc b${k} 47k`,
      `R${k}2 b${k} 0 10k`,
      `RC${k} vcc c${k} 4.7k`,
      `RE${k} e${k} 0 1k`,
      `CE${k} e${k} 0 100u`,
      `Q${k} c${k} b${k} e${k} QN`,
      `RD${k} c${k} a${k} 22k`,
      `D${k} a${k} 0 DX`,
      `C${k}2 c${k} s${k} 10u`,
    );
    if (k < stages) lines.push(`RB${k} s${k} 0 100k`);
  }
  lines.push(
    `RL s${stages} 0 10k`,
    `CL s${stages} 0 1n`,
    '.model QN NPN (IS=1e-14 BF=150 VAF=100)',
    '.model DX D (IS=1e-14 N=1.8)',
    '.end',
  );
  return lines.join('\n');
}

export function amplifierDraft(stages = 1): WorksheetDraft {
  return {
    circuit: parseDeck(amplifierDeck(stages)).circuit,
    settings: analysisSettingsSchema.parse({
      inputSource: 'VIN',
      outputNode: `s${stages}`,
      sweep: { type: 'dec', points: 10, fstart: 1, fstop: 100e6 },
    }),
  };
}

const person = (id: string, name: string) => ({ id, name });
const at = (minutes: number) =>
  new Date(Date.UTC(2026, 10, 20, 9, 0, 0) + minutes * 60_000).toISOString();

export interface SampleOptions {
  stages?: number;
  findings?: number;
  events?: number;
  signed?: boolean;
}

export function sampleRecord(options: SampleOptions = {}): RecordData {
  const draft = amplifierDraft(options.stages ?? 1);
  const computed = computeRevision(draft);
  const author = person('00000000-0000-4000-8000-000000000001', 'Ann Ωhm-Müller');
  const checker = person('00000000-0000-4000-8000-000000000002', 'Kim Checker');
  const approver = person('00000000-0000-4000-8000-000000000003', 'Abe Approver');
  const signatures: Signature[] =
    options.signed === false
      ? []
      : [
          {
            id: '00000000-0000-4000-8000-0000000000a1',
            revision: 'A',
            signer: approver,
            printedName: approver.name,
            meaning: 'Approved for release',
            contentHash: computed.contentHash,
            signedAt: at(600),
            supersededAt: null,
          },
        ];
  const findings: RecordFinding[] = Array.from({ length: options.findings ?? 3 }, (_, i) => ({
    id: `f${i}`,
    revision: 'A',
    path: `devices.q${(i % (options.stages ?? 1)) + 1}.ic`,
    severity: (['note', 'minor', 'major'] as const)[i % 3]!,
    text: `Collector current of stage ${i + 1}: check it against the 1 mA ± 10 % budget; rπ and gm follow from it, and so does the input impedance of the next stage.`,
    status: 'closed',
    createdBy: checker,
    createdAt: at(100 + i),
    updatedAt: at(300 + i),
    replies: [
      {
        id: `r${i}a`,
        kind: 'answer',
        text: 'Within budget at 27 °C; R1/R2 set VB ≈ 2.1 V.',
        by: author,
        at: at(200 + i),
      },
      { id: `r${i}c`, kind: 'close', text: 'Confirmed.', by: checker, at: at(300 + i) },
    ],
  }));
  const auditEvents = Array.from({ length: options.events ?? 8 }, (_, i) => ({
    seq: i + 1,
    at: at(i * 5),
    actor: i % 2 ? checker.name : author.name,
    action: i === 0 ? 'worksheet.created' : 'worksheet.updated',
    targetType: 'worksheet',
    details: { revision: 'A', version: i + 1, changed: ['circuit'] },
  }));
  return {
    org: { id: 'org', name: 'Quietline Analog (sample)', timezone: 'Europe/Berlin' },
    worksheet: {
      id: 'w',
      title: 'Microphone preamp bias',
      description: 'First gain stage of the hydrophone front end.',
      state: 'signed_off',
      projectId: 'p',
      projectName: 'Tidewater hydrophone',
      projectCode: 'TW-1',
      revision: 'A',
      version: 9,
      author,
      checker,
      approver,
      resultStatus: computed.resultStatus,
      createdAt: at(0),
      updatedAt: at(600),
    },
    revision: {
      letter: 'A',
      state: options.signed === false ? 'checked' : 'signed_off',
      isCurrent: true,
      draft,
      results: decodeResults(computed.results),
      storedResults: computed.results,
      engineVersion: computed.engineVersion,
      contentHash: computed.contentHash,
      frozen: true,
      createdAt: at(0),
      createdBy: author,
    },
    deck: { text: amplifierDeck(options.stages ?? 1) },
    signatures,
    findings,
    history: [
      {
        letter: 'A',
        state: 'signed_off',
        contentHash: computed.contentHash,
        frozen: true,
        engineVersion: computed.engineVersion,
        createdAt: at(0),
        createdBy: author,
        signatures,
        findingCount: findings.length,
      },
    ],
    auditEvents,
  };
}

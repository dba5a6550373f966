// The demo's projects, worksheets and library models in Quietline Analog: an invented
// hydrophone front end and an invented strain-gauge interface. Every value is an example
// value chosen for the demo, not a vendor part or a real design. Each circuit is written as
// a SPICE deck (what an author would import) with the analysis settings the worksheet uses.
import type { z } from 'zod';
import type { analysisSettingsSchema, ModelKind } from '@biasproof/calc';
import type { ModelRatings } from '@biasproof/shared';

export interface DemoWorksheet {
  title: string;
  description: string;
  /** E-mail of the author (an author of the organization). */
  author: string;
  deck: string;
  settings: z.input<typeof analysisSettingsSchema>;
  checker?: string;
  approver?: string;
}

export interface DemoProject {
  code: string;
  name: string;
  description: string;
  createdBy: string;
  worksheets: DemoWorksheet[];
}

export interface DemoModel {
  name: string;
  kind: ModelKind;
  params: Record<string, number>;
  ratings: ModelRatings;
  notes: string;
  createdBy: string;
}

export const DEMO_ORG_SLUG = 'quietline-analog';

const tomas = 'tomas.lindqvist@quietline.example';
const priya = 'priya.raman@quietline.example';
const kofi = 'kofi.mensah@quietline.example';
const elena = 'elena.sorokina@quietline.example';

const models = {
  QSW1: '.model QSW1 D (IS=4n N=1.9 RS=0.6)',
  QLN2: '.model QLN2 NPN (IS=12f BF=220 BR=4 NF=1 NR=1 VAF=90 VAR=20)',
  QLP2: '.model QLP2 PNP (IS=9f BF=160 BR=3 NF=1 NR=1 VAF=60 VAR=15)',
  QNM1: '.model QNM1 NMOS (LEVEL=1 VTO=0.7 KP=120u LAMBDA=0.03 GAMMA=0.4 PHI=0.7)',
};

const deck = (title: string, ...cards: string[]) => [title, ...cards, '.end', ''].join('\n');

export const demoProjects: DemoProject[] = [
  {
    code: 'TWH',
    name: 'Tidewater hydrophone front end',
    description:
      'Low-noise front end for a towed hydrophone: input protection and attenuation, a two-stage preamplifier and its bias.',
    createdBy: tomas,
    worksheets: [
      {
        title: 'Preamp bias reference (two-diode string)',
        description:
          'Two series junctions fed from the 12 V rail give a reference of about 1.2 V for the preamp bias; the small-signal view shows how much rail ripple reaches it.',
        author: tomas,
        deck: deck(
          'Preamp bias reference: two-diode string',
          'VCC vcc 0 DC 12 AC 1',
          'R1 vcc ref 10k',
          'D1 ref mid QSW1',
          'D2 mid 0 QSW1',
          'RL ref 0 100k',
          models.QSW1,
        ),
        settings: { inputSource: 'VCC', outputNode: 'ref', frequency: 100 },
        checker: kofi,
        approver: elena,
      },
      {
        title: 'Input attenuator (diode as a current-controlled resistor)',
        description:
          'A forward-biased diode shunts the hydrophone signal after a 4.7 kΩ series resistor; its bias current through RB sets rd and so the attenuation.',
        author: tomas,
        deck: deck(
          'Input attenuator: diode as a current-controlled resistor',
          'VIN sig 0 DC 0 AC 1',
          'C1 sig a 10u',
          'R1 a att 4.7k',
          'VB vb 0 DC 5',
          'RB vb att 8.2k',
          'D1 att 0 QSW1',
          'C2 att out 10u',
          'RL out 0 47k',
          models.QSW1,
        ),
        settings: { inputSource: 'VIN', outputNode: 'out', amplitude: 0.05 },
        checker: kofi,
      },
      {
        title: 'Preamp first stage (NPN common-emitter)',
        description:
          'Divider-biased common-emitter stage, about 1.3 mA; 100 Ω of unbypassed emitter resistance sets a gain near −30.',
        author: tomas,
        deck: deck(
          'Preamp first stage: NPN common-emitter',
          'VCC vcc 0 DC 12',
          'VS src 0 DC 0 AC 1',
          'RSRC src in 600',
          'CIN in b 10u',
          'R1 vcc b 47k',
          'R2 b 0 10k',
          'RC vcc c 4.7k',
          'Q1 c b e QLN2',
          'RE1 e e2 100',
          'RE2 e2 0 1k',
          'CE e2 0 100u',
          'COUT c out 10u',
          'RL out 0 22k',
          models.QLN2,
          '.ac dec 20 1 100meg',
        ),
        settings: { inputSource: 'VS', outputNode: 'out', amplitude: 0.002 },
        checker: kofi,
        approver: elena,
      },
      {
        title: 'Preamp second stage (PNP common-emitter)',
        description:
          'PNP stage hung from the 12 V rail so that its output sits near mid-supply for the line driver; about 1 mA.',
        author: priya,
        deck: deck(
          'Preamp second stage: PNP common-emitter',
          'VCC vcc 0 DC 12',
          'VS src 0 DC 0 AC 1',
          'CIN src b 10u',
          'R1 vcc b 22k',
          'R2 b 0 68k',
          'RE vcc e 2.2k',
          'CE vcc e 100u',
          'Q1 c b e QLP2',
          'RC c 0 4.7k',
          'COUT c out 10u',
          'RL out 0 47k',
          models.QLP2,
        ),
        settings: { inputSource: 'VS', outputNode: 'out', amplitude: 0.001 },
      },
      {
        title: 'Preamp tail current (NPN current mirror)',
        description:
          'Degenerated two-transistor mirror copying ~1 mA into the preamp; the small-signal view shows how rail ripple moves the output node.',
        author: tomas,
        deck: deck(
          'Preamp tail current: NPN current mirror',
          'VCC vcc 0 DC 12 AC 1',
          'RREF vcc ref 11k',
          'Q1 ref ref e1 QLN2',
          'Q2 out ref e2 QLN2',
          'RE1 e1 0 100',
          'RE2 e2 0 100',
          'RLOAD vcc out 4.7k',
          models.QLN2,
        ),
        settings: { inputSource: 'VCC', outputNode: 'out' },
      },
    ],
  },
  {
    code: 'FSG',
    name: 'Fieldstone strain-gauge interface',
    description:
      'Bridge excitation and amplification for a four-gauge load cell, on a 5 V and a 12 V rail.',
    createdBy: priya,
    worksheets: [
      {
        title: 'Bridge amplifier input (NMOS common-source)',
        description:
          'Divider-biased NMOS stage near 0.2 mA with a bypassed source resistor; gain about −gm·RD.',
        author: priya,
        deck: deck(
          'Bridge amplifier input: NMOS common-source',
          'VDD vdd 0 DC 5',
          'VS src 0 DC 0 AC 1',
          'CIN src g 1u',
          'R1 vdd g 390k',
          'R2 g 0 150k',
          'RD vdd d 10k',
          'M1 d g s 0 QNM1 W=20u L=2u',
          'RS s 0 500',
          'CS s 0 47u',
          'COUT d out 1u',
          'RL out 0 100k',
          models.QNM1,
        ),
        settings: { inputSource: 'VS', outputNode: 'out', amplitude: 0.01 },
        checker: kofi,
        approver: elena,
      },
      {
        title: 'Bridge amplifier differential pair (NMOS)',
        description:
          'NMOS pair with a 200 µA tail and 10 kΩ drain loads; both bridge outputs sit near 2.5 V.',
        author: priya,
        deck: deck(
          'Bridge amplifier differential pair: NMOS',
          'VDD vdd 0 DC 5',
          'VINP inp 0 DC 2.5 AC 1',
          'VINN inn 0 DC 2.5',
          'RD1 vdd d1 10k',
          'RD2 vdd d2 10k',
          'M1 d1 inp tail 0 QNM1 W=40u L=2u',
          'M2 d2 inn tail 0 QNM1 W=40u L=2u',
          'ITAIL tail 0 DC 200u',
          models.QNM1,
        ),
        settings: { inputSource: 'VINP', outputNode: 'd2', amplitude: 0.005 },
        checker: kofi,
      },
      {
        title: 'Excitation monitor gain stage (NPN common-emitter)',
        description:
          'Common-emitter stage meant to amplify the excitation ripple by about −RC/RE ≈ −3.3; the base divider was made stiff (10 kΩ / 22 kΩ) so that the base current does not matter.',
        author: priya,
        deck: deck(
          'Excitation monitor gain stage: NPN common-emitter',
          'VCC vcc 0 DC 12',
          'VS src 0 DC 0 AC 1',
          'CIN src b 10u',
          'R1 vcc b 10k',
          'R2 b 0 22k',
          'RC vcc c 3.3k',
          'Q1 c b e QLN2',
          'RE e 0 1k',
          'COUT c out 10u',
          'RL out 0 47k',
          models.QLN2,
        ),
        settings: { inputSource: 'VS', outputNode: 'out', amplitude: 0.01 },
        checker: kofi,
        approver: elena,
      },
    ],
  },
];

export const demoModels: DemoModel[] = [
  {
    name: 'QSW1',
    kind: 'D',
    params: { IS: 4e-9, N: 1.9, RS: 0.6 },
    ratings: { power: 0.5, current: 0.3, voltage: 75 },
    notes: 'Small-signal switching diode (example values).',
    createdBy: tomas,
  },
  {
    name: 'QLN2',
    kind: 'NPN',
    params: { IS: 12e-15, BF: 220, BR: 4, NF: 1, NR: 1, VAF: 90, VAR: 20 },
    ratings: { power: 0.5, current: 0.2, voltage: 40 },
    notes: 'Low-noise general-purpose NPN (example values).',
    createdBy: tomas,
  },
  {
    name: 'QLP2',
    kind: 'PNP',
    params: { IS: 9e-15, BF: 160, BR: 3, NF: 1, NR: 1, VAF: 60, VAR: 15 },
    ratings: { power: 0.5, current: 0.2, voltage: 40 },
    notes: 'Complement of QLN2 (example values).',
    createdBy: priya,
  },
  {
    name: 'QNM1',
    kind: 'NMOS',
    params: { VTO: 0.7, KP: 120e-6, LAMBDA: 0.03, GAMMA: 0.4, PHI: 0.7 },
    ratings: { power: 0.35, current: 0.1, voltage: 20 },
    notes: 'Small-signal NMOS, square-law fit (example values).',
    createdBy: priya,
  },
];

import {
  analysisSettingsSchema,
  diodeLaws,
  formatSpiceNumber,
  isEngineError,
  parseValue,
  type AnalysisSettings,
} from '@biasproof/calc';
import { z } from 'zod';

/** The analysis settings as the panel's fields hold them: text in engineering notation. */
export interface SettingsFormValues {
  diodeLaw: AnalysisSettings['diodeLaw'];
  vOn: string;
  v0: string;
  rd: string;
  temperature: string;
  inputSource: string;
  outputNode: string;
  sweepType: AnalysisSettings['sweep']['type'];
  points: string;
  fstart: string;
  fstop: string;
  frequency: string;
  amplitude: string;
  errorLimit: string;
}

type TextKey = Exclude<
  keyof SettingsFormValues,
  'diodeLaw' | 'sweepType' | 'inputSource' | 'outputNode'
>;

/** Unit each text field is checked against; none means trailing letters are ignored. */
const units: Record<TextKey, string | undefined> = {
  vOn: 'V',
  v0: 'V',
  rd: 'Ω',
  temperature: undefined,
  points: undefined,
  fstart: 'Hz',
  fstop: 'Hz',
  frequency: 'Hz',
  amplitude: undefined,
  errorLimit: undefined,
};

/** Where an issue of analysisSettingsSchema belongs in the panel. */
const fieldOf: Record<string, TextKey> = {
  'constantDrop.vOn': 'vOn',
  'piecewiseLinear.v0': 'v0',
  'piecewiseLinear.rd': 'rd',
  temperature: 'temperature',
  'sweep.points': 'points',
  'sweep.fstart': 'fstart',
  'sweep.fstop': 'fstop',
  frequency: 'frequency',
  amplitude: 'amplitude',
  errorLimit: 'errorLimit',
};

export const settingsFormSchema = z
  .object({
    diodeLaw: z.enum(diodeLaws),
    vOn: z.string(),
    v0: z.string(),
    rd: z.string(),
    temperature: z.string(),
    inputSource: z.string(),
    outputNode: z.string(),
    sweepType: z.enum(['dec', 'oct', 'lin']),
    points: z.string(),
    fstart: z.string(),
    fstop: z.string(),
    frequency: z.string(),
    amplitude: z.string(),
    errorLimit: z.string(),
  })
  .transform((form, ctx): AnalysisSettings => {
    const n = {} as Record<TextKey, number>;
    for (const key of Object.keys(units) as TextKey[]) {
      try {
        const unit = units[key];
        n[key] = parseValue(form[key], unit === undefined ? {} : { unit });
      } catch (e) {
        ctx.addIssue({
          code: 'custom',
          path: [key],
          message: isEngineError(e) ? e.message : String(e),
        });
      }
    }
    if (ctx.issues.length > 0) return z.NEVER;
    const parsed = analysisSettingsSchema.safeParse({
      diodeLaw: form.diodeLaw,
      constantDrop: { vOn: n.vOn },
      piecewiseLinear: { v0: n.v0, rd: n.rd },
      temperature: n.temperature,
      inputSource: form.inputSource,
      outputNode: form.outputNode,
      sweep: { type: form.sweepType, points: n.points, fstart: n.fstart, fstop: n.fstop },
      frequency: n.frequency,
      amplitude: n.amplitude,
      errorLimit: n.errorLimit,
    });
    if (parsed.success) return parsed.data;
    for (const issue of parsed.error.issues) {
      const key = fieldOf[issue.path.join('.')] ?? 'temperature';
      const message =
        key === 'points' && issue.code === 'invalid_type'
          ? 'The point count is a whole number.'
          : issue.message;
      ctx.addIssue({ code: 'custom', path: [key], message });
    }
    return z.NEVER;
  });

const spice = formatSpiceNumber;

export function settingsFormValues(s: AnalysisSettings): SettingsFormValues {
  return {
    diodeLaw: s.diodeLaw,
    vOn: spice(s.constantDrop.vOn),
    v0: spice(s.piecewiseLinear.v0),
    rd: spice(s.piecewiseLinear.rd),
    temperature: String(s.temperature),
    inputSource: s.inputSource,
    outputNode: s.outputNode,
    sweepType: s.sweep.type,
    points: String(s.sweep.points),
    fstart: spice(s.sweep.fstart),
    fstop: spice(s.sweep.fstop),
    frequency: spice(s.frequency),
    amplitude: spice(s.amplitude),
    errorLimit: String(s.errorLimit),
  };
}

/** True when two settings would show the same text in the panel. */
export function sameSettings(a: AnalysisSettings, b: AnalysisSettings): boolean {
  return JSON.stringify(settingsFormValues(a)) === JSON.stringify(settingsFormValues(b));
}

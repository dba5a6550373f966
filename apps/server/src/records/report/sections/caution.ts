import { heading, paragraph, type Layout } from '../layout.ts';

/** The product's caution statement (README), printed on the cover and at the end of every report. */
export const CAUTION =
  'Caution. Biasproof results are engineering aids, not a substitute for qualified review. ' +
  'Safety-related designs and circuits that carry hazardous voltages must follow local codes ' +
  'and licensed engineering practice; a Biasproof sign-off does not replace either.';

export function cautionSection(l: Layout): void {
  heading(l, 'Caution');
  paragraph(l, CAUTION, { size: 9.5 });
  paragraph(
    l,
    'The numbers in this report come from the engine version named on the cover, run on the ' +
      'circuit and settings listed here; the content hash identifies exactly those inputs and results.',
    { size: 9 },
  );
}

import { z } from 'zod';

/**
 * The stored results tables `GET …/revisions/:letter/results.csv?table=` writes, named after the
 * worksheet's result views: node voltages, element currents and powers (`bias`); diodes and
 * transistors (`devices`); gain and impedances (`small-signal`); the sweep's points (`sweep`).
 */
export const resultTables = ['bias', 'devices', 'small-signal', 'sweep'] as const;
export type ResultTable = (typeof resultTables)[number];

export const resultsCsvQuerySchema = z.object({
  table: z.enum(resultTables, `Choose table=${resultTables.join(', ')}.`),
});

import { z } from 'zod';
import { circuitSchema, type DeviceModel, type Element } from '../circuit.ts';
import { analysisSettingsSchema, type AnalysisSettings } from './settings.ts';

/**
 * What an author edits and what a revision freezes: the circuit (the engine's plain data) and
 * the analysis settings. Elements and models are kept complete (defaults such as `area` filled
 * in) so that what the editor shows is exactly what the engine solves.
 */
export const worksheetDraftSchema = z.object({
  circuit: circuitSchema,
  settings: analysisSettingsSchema,
});

export interface WorksheetDraft {
  circuit: DraftCircuit;
  settings: AnalysisSettings;
}

/** A circuit with its lists always present. */
export interface DraftCircuit {
  title: string;
  elements: Element[];
  models: DeviceModel[];
}

export function emptyCircuit(title = ''): DraftCircuit {
  return { title, elements: [], models: [] };
}

/** Case-insensitive name comparison, as SPICE treats element, node and model names. */
export function sameName(a: string, b: string): boolean {
  return a.toLowerCase() === b.toLowerCase();
}

import type { z } from 'zod';
import { exportDeck, isEngineError, parseDeck, type ParsedDeck } from '@biasproof/calc';
import {
  apiCircuitSchema,
  apiSettingsSchema,
  type ImportDeckResponse,
  type importDeckRequestSchema,
} from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { OrgContext } from '../orgs/org-scope.ts';
import { applyDraft, storedDraft } from './draft-change.ts';
import { assertMayEdit, assertVersion, lockEditableRevision, lockWorksheet } from './guards.ts';
import { readRevision, readWorksheetItem, saveWorksheet } from './repository.ts';
import { noSuchWorksheet, readWorksheet, type WorksheetBody } from './worksheets.ts';

const fileSafe = (s: string) =>
  s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60) || 'worksheet';

/** The current revision as a SPICE deck, with `.temp`, `.op` and the sweep's `.ac` line. */
export async function exportWorksheetDeck(
  org: OrgContext,
  id: string,
): Promise<{ filename: string; text: string }> {
  return org.read(async (tx) => {
    const item = await readWorksheetItem(tx, id);
    const revision = item ? await readRevision(tx, id, item.revision) : null;
    if (!item || !revision) throw noSuchWorksheet();
    const { circuit, settings } = storedDraft(revision);
    try {
      const text = exportDeck(circuit, {
        op: true,
        temperature: settings.temperature,
        ac: settings.sweep,
      });
      const filename = `${fileSafe(item.projectCode)}-${fileSafe(item.title)}-rev-${item.revision.toLowerCase()}.cir`;
      return { filename, text };
    } catch (e) {
      if (!isEngineError(e)) throw e;
      throw new AppError('unprocessable', `The circuit cannot be written as a deck: ${e.message}`);
    }
  });
}

/** 400 naming the deck line (`fields["line 7"]`) when the parser refuses the deck. */
function readDeck(text: string): ParsedDeck {
  try {
    return parseDeck(text);
  } catch (e) {
    if (!isEngineError(e)) throw e;
    const line = e.details.line;
    const key = line ? `line ${line}` : 'text';
    const message = line ? e.message.replace(/^line \d+:\s*/, '') : e.message;
    throw new AppError('validation-failed', `The deck was not imported: ${key}: ${message}`, {
      [key]: message,
    });
  }
}

function rejectDraft(prefix: string, error: z.ZodError): never {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    fields[[prefix, ...issue.path].join('.')] ??= issue.message;
  }
  throw new AppError(
    'validation-failed',
    'The deck was not imported: some values are not valid',
    fields,
  );
}

/**
 * Replaces the draft's circuit with the deck's and takes `.temp` and `.ac` into the settings
 * (other settings stay). Nothing is saved when the deck has an error. One audit event when
 * the draft changed.
 */
export async function importWorksheetDeck(
  org: OrgContext,
  id: string,
  input: z.output<typeof importDeckRequestSchema>,
): Promise<{ worksheet: WorksheetBody; warnings: ImportDeckResponse['warnings'] }> {
  return org.write(async (tx) => {
    const worksheet = await lockWorksheet(tx, id);
    assertMayEdit(org, worksheet);
    const deck = readDeck(input.text);
    assertVersion(worksheet, input.version);
    const revision = await lockEditableRevision(tx, worksheet);
    const current = storedDraft(revision);
    const circuit = apiCircuitSchema.safeParse(deck.circuit);
    if (!circuit.success) rejectDraft('circuit', circuit.error);
    const settings = apiSettingsSchema.safeParse({
      ...current.settings,
      ...(deck.directives.temperature !== undefined
        ? { temperature: deck.directives.temperature }
        : {}),
      ...(deck.directives.ac ? { sweep: deck.directives.ac } : {}),
    });
    if (!settings.success) rejectDraft('settings', settings.error);

    const draft = await applyDraft(tx, revision, {
      circuit: circuit.data,
      settings: settings.data,
    });
    if (draft.changed.length > 0 || draft.computed) {
      await saveWorksheet(tx, worksheet, { version: worksheet.version + 1 });
      await tx.audit({
        action: 'worksheet.deck-imported',
        targetType: 'worksheet',
        targetId: id,
        details: {
          version: worksheet.version,
          revision: revision.letter,
          changed: draft.changed,
          elements: circuit.data.elements.length,
          warnings: deck.warnings.length,
          ...(draft.computed
            ? {
                contentHash: draft.computed.contentHash,
                engineVersion: draft.computed.engineVersion,
              }
            : {}),
        },
      });
    }
    return { worksheet: await readWorksheet(tx, id), warnings: deck.warnings };
  });
}

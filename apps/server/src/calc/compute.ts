import { createHash } from 'node:crypto';
import { computeWorksheet, ENGINE_VERSION, type WorksheetDraft } from '@biasproof/calc';
import { canonicalJson, encodeResults, type EncodedResults } from '@biasproof/shared';

/** What a revision stores about one computation of its draft. */
export interface ComputedRevision {
  circuit: WorksheetDraft['circuit'];
  settings: WorksheetDraft['settings'];
  /** The engine's results, non-finite numbers written as strings (canonical-json.ts). */
  results: EncodedResults;
  resultStatus: 'solved' | 'failed' | 'empty';
  engineVersion: string;
  contentHash: string;
}

/** SHA-256 (hex) of the canonical JSON of `{circuit, settings, results}`: the revision's content hash. */
export function contentHash(content: {
  circuit: unknown;
  settings: unknown;
  results: unknown;
}): string {
  const { circuit, settings, results } = content;
  return createHash('sha256').update(canonicalJson({ circuit, settings, results })).digest('hex');
}

/**
 * Runs the engine on a validated draft, exactly as the browser preview does, and hashes what
 * will be stored. Pure: the same draft gives the same results and the same hash.
 */
export function computeRevision(draft: WorksheetDraft): ComputedRevision {
  const computed = computeWorksheet(draft);
  const results = encodeResults(computed);
  return {
    circuit: draft.circuit,
    settings: draft.settings,
    results,
    resultStatus: computed.status,
    engineVersion: ENGINE_VERSION,
    contentHash: contentHash({ circuit: draft.circuit, settings: draft.settings, results }),
  };
}

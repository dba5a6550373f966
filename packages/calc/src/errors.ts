/**
 * The one error type the engine throws. Every failure names what it is about (an element, a
 * node, a deck line) so that the UI can point at it; the engine never returns NaN instead.
 */
export type EngineErrorCode =
  | 'invalid-circuit'
  | 'floating-node'
  | 'dangling-node'
  | 'voltage-source-loop'
  | 'bad-value'
  | 'unknown-model'
  | 'no-convergence'
  | 'state-cycle'
  | 'singular-matrix'
  | 'deck-syntax'
  | 'bad-option';

export interface EngineErrorDetails {
  /** Element the error is about, lowercase (e.g. `r1`). */
  element?: string;
  /** Node the error is about, lowercase. */
  node?: string;
  /** 1-based line of the deck the error is about. */
  line?: number;
  /** The offending token of that line. */
  token?: string;
}

export class EngineError extends Error {
  override readonly name = 'EngineError';
  constructor(
    readonly code: EngineErrorCode,
    message: string,
    readonly details: EngineErrorDetails = {},
  ) {
    super(message);
  }
}

export function isEngineError(e: unknown): e is EngineError {
  return e instanceof EngineError;
}

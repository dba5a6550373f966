import type { Circuit, CircuitInput } from './circuit.ts';
import { circuitSchema } from './circuit.ts';
import { EngineError } from './errors.ts';

/** Deck lines of each element and model, by index, when the circuit came from a deck. */
export interface SourceLines {
  elements: readonly number[];
  models: readonly number[];
}

const at = (line: number | undefined): string => (line === undefined ? '' : `line ${line}: `);

/**
 * Validates a circuit with circuitSchema and turns the first issue into an EngineError
 * `invalid-circuit` naming the element (or model) and, for a deck, its line.
 */
export function validateCircuit(
  input: CircuitInput,
  lines: SourceLines = { elements: [], models: [] },
): Circuit {
  const parsed = circuitSchema.safeParse(input);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  const message = issue?.message ?? 'invalid';
  const [group, index, ...field] = issue?.path ?? [];
  const i = typeof index === 'number' ? index : 0;
  const fieldName = field.map(String).join('.');
  if (group === 'elements') {
    const name = input.elements[i]?.name ?? `element ${i + 1}`;
    const line = lines.elements[i];
    throw new EngineError(
      'invalid-circuit',
      `${at(line)}${name}${fieldName ? ` ${fieldName}` : ''}: ${message}`,
      {
        element: name.toLowerCase(),
        ...(line === undefined ? {} : { line }),
        ...(fieldName ? { token: fieldName } : {}),
      },
    );
  }
  if (group === 'models') {
    const line = lines.models[i];
    const name = input.models?.[i]?.name ?? `model ${i + 1}`;
    throw new EngineError(
      'invalid-circuit',
      `${at(line)}model ${name}${fieldName ? ` ${fieldName}` : ''}: ${message}`,
      line === undefined ? {} : { line },
    );
  }
  throw new EngineError(
    'invalid-circuit',
    `${String(group ?? 'circuit')}: ${message}`,
    group === 'title' ? { line: 1 } : {},
  );
}

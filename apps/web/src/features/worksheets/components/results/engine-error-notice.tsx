import { Button } from '@/components/ui/button.tsx';
import type { ComputeError } from '@biasproof/calc';

interface EngineErrorNoticeProps {
  title: string;
  error: ComputeError;
  show: (name: string) => string;
  /** Moves focus to the element's row in the editor. */
  onGoToElement?: (name: string) => void;
}

const what: Record<string, string> = {
  'floating-node': 'A node has no DC path to ground.',
  'dangling-node': 'A node is connected to only one terminal.',
  'voltage-source-loop': 'Voltage sources (or inductors) form a loop.',
  'no-convergence': 'The solver did not converge.',
  'state-cycle': 'The simplified diode law keeps switching states.',
  'singular-matrix': 'The circuit equations have no unique solution.',
  'unknown-model': 'An element names a model that does not exist.',
  'invalid-circuit': 'An element is not valid.',
  'bad-option': 'A setting does not fit the circuit.',
  'bad-value': 'A value is not a number.',
};

/** An engine error in words, naming the element or node it is about. */
export function EngineErrorNotice({ title, error, show, onGoToElement }: EngineErrorNoticeProps) {
  return (
    <div
      role="alert"
      className="flex flex-col gap-2 rounded-md border-l-4 border-fault bg-fault-tint px-4 py-3 text-sm text-fault"
    >
      <p className="font-bold">{title}</p>
      {what[error.code] ? <p className="font-semibold">{what[error.code]}</p> : null}
      <p>{error.message}</p>
      {error.element || error.node ? (
        <p className="flex flex-wrap items-center gap-3">
          {error.element ? (
            <span>
              Element: <strong>{show(error.element)}</strong>
            </span>
          ) : null}
          {error.node ? (
            <span>
              Node: <strong className="font-mono">{error.node}</strong>
            </span>
          ) : null}
          {error.element && onGoToElement ? (
            <Button size="sm" variant="dangerOutline" onClick={() => onGoToElement(error.element!)}>
              Go to {show(error.element)}
            </Button>
          ) : null}
        </p>
      ) : null}
    </div>
  );
}

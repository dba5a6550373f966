import type { Element } from '@biasproof/calc';
import { Fragment } from 'react';
import { Button } from '@/components/ui/button.tsx';
import { kindSpecs } from '@/features/worksheets/components/editor/element-kinds.ts';
import { elementSummary } from '@/features/worksheets/components/editor/element-summary.ts';

interface ElementTableProps {
  elements: readonly Element[];
  /** Lowercase names of elements the engine's error is about (highlighted). */
  flagged: ReadonlySet<string>;
  /** Index of the element open in the form, if any. */
  editing: number | null;
  onEdit: (index: number) => void;
  onDuplicate: (index: number) => void;
  onDelete: (index: number) => void;
  /** No action buttons: the worksheet cannot be changed. */
  readOnly?: boolean;
}

const head = 'px-2 py-2 text-left text-xs font-semibold uppercase tracking-wide text-ink-600';
const cell = 'px-2 py-2 align-top text-sm';

export function ElementTable({
  elements,
  flagged,
  editing,
  onEdit,
  onDuplicate,
  onDelete,
  readOnly = false,
}: ElementTableProps) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse">
        <caption className="sr-only">Elements of the circuit ({elements.length})</caption>
        <thead className="border-b border-rule">
          <tr>
            <th scope="col" className={head}>
              Name
            </th>
            <th scope="col" className={head}>
              Kind
            </th>
            <th scope="col" className={head}>
              Nodes
            </th>
            <th scope="col" className={head}>
              Value or model
            </th>
            {readOnly ? null : (
              <th scope="col" className={head}>
                <span className="sr-only">Actions</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody>
          {elements.map((el, index) => {
            const spec = kindSpecs[el.kind];
            const isFlagged = flagged.has(el.name.toLowerCase());
            return (
              <tr
                key={`${el.name}-${index}`}
                data-element={el.name.toLowerCase()}
                aria-current={editing === index ? 'true' : undefined}
                className={`border-b border-rule last:border-b-0 ${isFlagged ? 'bg-fault-tint' : editing === index ? 'bg-accent-tint' : ''}`}
              >
                <th scope="row" className={`${cell} text-left font-semibold text-ink-900`}>
                  {el.name}{' '}
                  {isFlagged ? (
                    <span className="ml-2 rounded-full bg-fault px-2 py-0.5 text-xs font-semibold text-white">
                      engine error
                    </span>
                  ) : null}
                </th>
                <td className={`${cell} text-ink-700`}>{spec.label}</td>
                <td className={`${cell} font-mono text-ink-900`}>
                  {el.nodes.map((node, i) => (
                    <Fragment key={i}>
                      <span title={`${spec.nodeLabels[i]} node`} className="mr-2 inline-block">
                        <span className="sr-only">{`${spec.nodeLabels[i]} node:`}</span> {node}
                      </span>{' '}
                    </Fragment>
                  ))}
                </td>
                <td className={`${cell} tabular-nums text-ink-900`}>{elementSummary(el)}</td>
                {readOnly ? null : (
                  <td className={`${cell} whitespace-nowrap text-right`}>
                    <Button
                      size="sm"
                      variant="quiet"
                      aria-label={`Edit ${el.name}`}
                      onClick={() => onEdit(index)}
                    >
                      Edit
                    </Button>
                    <Button
                      size="sm"
                      variant="quiet"
                      aria-label={`Duplicate ${el.name}`}
                      onClick={() => onDuplicate(index)}
                    >
                      Duplicate
                    </Button>
                    <Button
                      size="sm"
                      variant="quiet"
                      aria-label={`Delete ${el.name}`}
                      onClick={() => onDelete(index)}
                    >
                      Delete
                    </Button>
                  </td>
                )}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

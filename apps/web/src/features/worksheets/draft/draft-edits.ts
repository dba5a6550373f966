import {
  sameName,
  type AnalysisSettings,
  type DeviceModel,
  type DraftCircuit,
  type Element,
  type WorksheetDraft,
} from '@biasproof/calc';
import {
  circuitNodes,
  independentSources,
  nextElementName,
} from '@/features/worksheets/draft/circuit-facts.ts';

/** Every change an author can make to a draft, as data (so that it can be undone and named). */
export type DraftEdit =
  | { type: 'add-element'; element: Element }
  | { type: 'update-element'; index: number; element: Element }
  | { type: 'delete-element'; index: number }
  | { type: 'duplicate-element'; index: number }
  | { type: 'set-title'; title: string }
  | { type: 'add-model'; model: DeviceModel }
  | { type: 'update-model'; index: number; model: DeviceModel }
  | { type: 'delete-model'; index: number }
  | { type: 'set-settings'; settings: AnalysisSettings }
  | { type: 'replace'; draft: WorksheetDraft; reason: string }
  /** Removes every element and model; the title and settings stay. */
  | { type: 'clear' };

function withCircuit(draft: WorksheetDraft, circuit: DraftCircuit): WorksheetDraft {
  return { circuit, settings: reconcileSettings(circuit, draft.settings) };
}

/**
 * Keeps the settings pointing at things that exist: an input source that was removed gives way
 * to the first remaining source, an output node no element names any more is cleared.
 */
export function reconcileSettings(
  circuit: DraftCircuit,
  settings: AnalysisSettings,
): AnalysisSettings {
  const sources = independentSources(circuit);
  const input = sources.find((s) => sameName(s.name, settings.inputSource));
  const inputSource = input?.name ?? sources[0]?.name ?? '';
  const output = settings.outputNode.toLowerCase();
  const outputNode = circuitNodes(circuit).includes(output) ? output : '';
  if (inputSource === settings.inputSource && outputNode === settings.outputNode) return settings;
  return { ...settings, inputSource, outputNode };
}

function renameModel(elements: Element[], from: string, to: string): Element[] {
  if (sameName(from, to)) return elements;
  return elements.map((el) =>
    'model' in el && sameName(el.model, from) ? { ...el, model: to } : el,
  );
}

export function applyEdit(draft: WorksheetDraft, edit: DraftEdit): WorksheetDraft {
  const { circuit } = draft;
  switch (edit.type) {
    case 'add-element':
      return withCircuit(draft, { ...circuit, elements: [...circuit.elements, edit.element] });
    case 'update-element': {
      const before = circuit.elements[edit.index];
      const elements = circuit.elements.map((el, i) => (i === edit.index ? edit.element : el));
      // A renamed input source stays the input.
      const settings =
        before && sameName(before.name, draft.settings.inputSource)
          ? { ...draft.settings, inputSource: edit.element.name }
          : draft.settings;
      return withCircuit({ ...draft, settings }, { ...circuit, elements });
    }
    case 'delete-element':
      return withCircuit(draft, {
        ...circuit,
        elements: circuit.elements.filter((_, i) => i !== edit.index),
      });
    case 'duplicate-element': {
      const original = circuit.elements[edit.index];
      if (!original) return draft;
      const copy = { ...original, name: nextElementName(circuit, original.kind) };
      const elements = [...circuit.elements];
      elements.splice(edit.index + 1, 0, copy);
      return withCircuit(draft, { ...circuit, elements });
    }
    case 'set-title':
      return { ...draft, circuit: { ...circuit, title: edit.title } };
    case 'add-model':
      return { ...draft, circuit: { ...circuit, models: [...circuit.models, edit.model] } };
    case 'update-model': {
      const before = circuit.models[edit.index];
      if (!before) return draft;
      return {
        ...draft,
        circuit: {
          ...circuit,
          models: circuit.models.map((m, i) => (i === edit.index ? edit.model : m)),
          elements: renameModel(circuit.elements, before.name, edit.model.name),
        },
      };
    }
    case 'delete-model':
      return {
        ...draft,
        circuit: { ...circuit, models: circuit.models.filter((_, i) => i !== edit.index) },
      };
    case 'set-settings': {
      const settings = reconcileSettings(circuit, edit.settings);
      return JSON.stringify(settings) === JSON.stringify(draft.settings)
        ? draft
        : { ...draft, settings };
    }
    case 'replace':
      return withCircuit(edit.draft, edit.draft.circuit);
    case 'clear':
      return withCircuit(draft, { ...circuit, elements: [], models: [] });
  }
}

/** The words for an edit in "Undo: …" and "Redo: …". */
export function describeEdit(draft: WorksheetDraft, edit: DraftEdit): string {
  const { elements, models } = draft.circuit;
  switch (edit.type) {
    case 'add-element':
      return `add ${edit.element.name}`;
    case 'update-element':
      return `change ${elements[edit.index]?.name ?? edit.element.name}`;
    case 'delete-element':
      return `delete ${elements[edit.index]?.name ?? 'element'}`;
    case 'duplicate-element':
      return `duplicate ${elements[edit.index]?.name ?? 'element'}`;
    case 'set-title':
      return 'rename the block';
    case 'add-model':
      return `add model ${edit.model.name}`;
    case 'update-model':
      return `change model ${models[edit.index]?.name ?? edit.model.name}`;
    case 'delete-model':
      return `delete model ${models[edit.index]?.name ?? ''}`.trim();
    case 'set-settings':
      return 'change analysis settings';
    case 'replace':
      return edit.reason;
    case 'clear':
      return 'clear the circuit';
  }
}

import { describe, expect, it } from 'vitest';
import {
  historyLabels,
  historyReducer,
  HISTORY_LIMIT,
  startHistory,
} from '@/features/worksheets/draft/draft-history.ts';
import { starterDraft } from '@/features/worksheets/draft/starter-draft.ts';

const temperatureTo = (t: number) => {
  const draft = starterDraft();
  return {
    type: 'edit' as const,
    edit: { type: 'set-settings' as const, settings: { ...draft.settings, temperature: t } },
    coalesce: 'settings.temperature',
  };
};

describe('draft history', () => {
  it('when edits are undone and redone, then each step comes back with its name', () => {
    let h = startHistory(starterDraft());
    h = historyReducer(h, { type: 'edit', edit: { type: 'delete-element', index: 1 } });
    h = historyReducer(h, { type: 'edit', edit: { type: 'duplicate-element', index: 0 } });
    expect(h.present.circuit.elements.map((e) => e.name)).toEqual(['V1', 'V2', 'D1']);
    expect(historyLabels(h)).toEqual({ undo: 'duplicate V1', redo: null });

    h = historyReducer(h, { type: 'undo' });
    expect(h.present.circuit.elements.map((e) => e.name)).toEqual(['V1', 'D1']);
    expect(historyLabels(h)).toEqual({ undo: 'delete R1', redo: 'duplicate V1' });
    h = historyReducer(h, { type: 'undo' });
    expect(h.present).toEqual(starterDraft());
    h = historyReducer(h, { type: 'redo' });
    expect(h.present.circuit.elements.map((e) => e.name)).toEqual(['V1', 'D1']);

    // A new edit after an undo drops what could have been redone.
    h = historyReducer(h, { type: 'edit', edit: { type: 'set-title', title: 'Other' } });
    expect(historyLabels(h)).toEqual({ undo: 'rename the block', redo: null });
  });

  it('when one field is typed into several times, then it is one undo step; another field starts a new one', () => {
    let h = startHistory(starterDraft());
    h = historyReducer(h, temperatureTo(8));
    h = historyReducer(h, temperatureTo(85));
    expect(h.past).toHaveLength(1);
    h = historyReducer(h, {
      type: 'edit',
      edit: { type: 'set-title', title: 'Hot' },
      coalesce: 'title',
    });
    h = historyReducer(h, temperatureTo(100));
    expect(h.past).toHaveLength(3);
    h = historyReducer(h, { type: 'undo' });
    h = historyReducer(h, { type: 'undo' });
    expect(h.present.settings.temperature).toBe(85);
    h = historyReducer(h, { type: 'undo' });
    expect(h.present.settings.temperature).toBe(27);
  });

  it('when an edit changes nothing, then no step is recorded', () => {
    const start = startHistory(starterDraft());
    const h = historyReducer(start, {
      type: 'edit',
      edit: { type: 'set-settings', settings: starterDraft().settings },
    });
    expect(h).toBe(start);
  });

  it('when the session is long, then the oldest steps are forgotten', () => {
    let h = startHistory(starterDraft());
    for (let i = 0; i < HISTORY_LIMIT + 20; i++) {
      h = historyReducer(h, { type: 'edit', edit: { type: 'set-title', title: `t${i}` } });
    }
    expect(h.past).toHaveLength(HISTORY_LIMIT);
  });

  it('when the input source is removed or renamed, then the settings follow', () => {
    let h = startHistory(starterDraft());
    h = historyReducer(h, {
      type: 'edit',
      edit: {
        type: 'update-element',
        index: 0,
        element: { kind: 'V', name: 'VIN', nodes: ['in', '0'], dc: 5 },
      },
    });
    expect(h.present.settings.inputSource).toBe('VIN');
    h = historyReducer(h, { type: 'edit', edit: { type: 'delete-element', index: 2 } });
    expect(h.present.settings.outputNode).toBe('out');
    h = historyReducer(h, { type: 'edit', edit: { type: 'delete-element', index: 1 } });
    expect(h.present.settings.outputNode).toBe('');
    h = historyReducer(h, { type: 'edit', edit: { type: 'delete-element', index: 0 } });
    expect(h.present.settings.inputSource).toBe('');
  });
});

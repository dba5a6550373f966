import { act, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { describe, expect, it } from 'vitest';
import type {
  ComputeAnswer,
  ComputeFunction,
} from '@/features/worksheets/compute/compute-function.ts';
import { WorksheetComputeProvider } from '@/features/worksheets/compute/compute-context.tsx';
import type { WorksheetDraft } from '@biasproof/calc';
import { starterDraft } from '@/features/worksheets/draft/starter-draft.ts';
import { useLiveResults } from '@/features/worksheets/hooks/use-live-results.ts';

/** A compute function whose answers the test releases by hand, in any order. */
function manualCompute() {
  const calls: { draft: WorksheetDraft; answer: (a: ComputeAnswer) => void }[] = [];
  const compute: ComputeFunction = (draft) =>
    new Promise((resolve) => calls.push({ draft, answer: resolve }));
  return { calls, compute };
}

const failed = (message: string): ComputeAnswer => ({
  result: { status: 'failed', error: { code: 'x', message } },
  elapsedMs: 1,
});

describe('live results', () => {
  it('when an older computation answers after a newer one was asked for, then its answer is dropped', async () => {
    const { calls, compute } = manualCompute();
    const wrapper = ({ children }: { children: ReactNode }) => (
      <WorksheetComputeProvider compute={compute}>{children}</WorksheetComputeProvider>
    );
    const first = starterDraft();
    const second = { ...first, circuit: { ...first.circuit, title: 'second' } };
    const { result, rerender } = renderHook(({ draft }) => useLiveResults(draft), {
      wrapper,
      initialProps: { draft: first },
    });
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(result.current.computing).toBe(true);

    rerender({ draft: second });
    await waitFor(() => expect(calls).toHaveLength(2));
    await act(async () => {
      calls[1]!.answer(failed('second'));
      await Promise.resolve();
    });
    await waitFor(() => expect(result.current.computedDraft).toBe(second));
    expect(result.current.computing).toBe(false);

    await act(async () => {
      calls[0]!.answer(failed('first, stale'));
      await Promise.resolve();
    });
    expect(result.current.result).toEqual(failed('second').result);
    expect(result.current.computedDraft).toBe(second);
  });

  it('when drafts change faster than the debounce, then only the last is computed', async () => {
    const { calls, compute } = manualCompute();
    const wrapper = ({ children }: { children: ReactNode }) => (
      <WorksheetComputeProvider compute={compute}>{children}</WorksheetComputeProvider>
    );
    const drafts = [1, 2, 3].map((i) => ({
      ...starterDraft(),
      settings: { ...starterDraft().settings, temperature: i },
    }));
    const { rerender } = renderHook(({ draft }) => useLiveResults(draft), {
      wrapper,
      initialProps: { draft: drafts[0]! },
    });
    rerender({ draft: drafts[1]! });
    rerender({ draft: drafts[2]! });
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]!.draft).toBe(drafts[2]);
  });
});

import { screen, waitFor, within } from '@testing-library/react';
import { formatValue, runMonteCarlo, type LimitInput } from '@biasproof/calc';
import { afterEach, describe, expect, it } from 'vitest';
import {
  fill,
  renderWorksheet,
  resultText,
} from '@/features/worksheets/components/__tests__/worksheet-test-kit.tsx';
import {
  divider,
  onePercent,
  openView,
} from '@/features/worksheets/components/variation/__tests__/variation-test-kit.ts';

const limits: LimitInput[] = [{ path: 'nodes.out', min: 4.97, max: 5.03, unit: 'V' }];

/** Every aria-valuenow the progress bar shows, in order. */
function recordProgress() {
  const seen: number[] = [];
  const observer = new MutationObserver(() => {
    const bar = document.querySelector('[role="progressbar"]');
    const now = Number(bar?.getAttribute('aria-valuenow'));
    if (bar && seen.at(-1) !== now) seen.push(now);
  });
  observer.observe(document.body, { subtree: true, childList: true, attributes: true });
  stops.push(() => observer.disconnect());
  return seen;
}
const stops: (() => void)[] = [];
afterEach(() => stops.splice(0).forEach((stop) => stop()));

describe('Monte Carlo in the variation view', () => {
  it('when the author runs 600 samples, then the progress bar climbs, the histogram and yield are the engine’s, and undo takes the recorded run back', async () => {
    const { user } = renderWorksheet(() => divider({ ...onePercent, limits }));
    const view = await openView(user, 'Variation');
    const run = within(view).getByRole('form', { name: 'Monte Carlo run' });
    await fill(user, run, { Samples: '600', Seed: 'bench-7' });
    const seen = recordProgress();
    await user.click(within(run).getByRole('button', { name: 'Run Monte Carlo' }));

    expect(
      await within(view).findByRole(
        'img',
        { name: /^Histogram of nodes\.out: 600 samples/ },
        { timeout: 20_000 },
      ),
    ).toBeDefined();
    expect(seen.length).toBeGreaterThan(3);
    expect(seen).toEqual([...seen].sort((a, b) => a - b));
    expect(seen[0]).toBeLessThan(600);

    // The same seed gives the same samples: the engine's own run is the reference.
    const draft = divider({ ...onePercent, limits });
    const engine = runMonteCarlo({
      circuit: draft.circuit,
      settings: draft.settings,
      parameters: onePercent.parameters!,
      probes: ['nodes.out'],
      samples: 600,
      seed: 'bench-7',
      limits,
    });
    expect(resultText('variation.monteCarlo.yield')).toBe(
      formatValue(engine.yield!.fraction * 100, '%'),
    );
    const stats = engine.probes['nodes.out']!.statistics;
    expect(resultText('variation.monteCarlo.nodes.out.mean')).toBe(formatValue(stats.mean, 'V'));
    expect(resultText('variation.monteCarlo.nodes.out.sigma')).toBe(formatValue(stats.sigma, 'V'));
    expect(within(view).getByText(/Run in this browser/).textContent).toContain('seed “bench-7”');

    const undo = screen.getByRole('button', { name: 'Undo' });
    expect(undo.getAttribute('title')).toBe('Undo: change analysis settings (Ctrl+Z)');
    await user.click(undo);
    await waitFor(() => expect(within(view).queryByTestId('monte-carlo-result')).toBeNull());
    await user.click(screen.getByRole('button', { name: 'Redo' }));
    expect(await within(view).findByTestId('monte-carlo-result')).toBeDefined();
  });

  it('when the author cancels a long run, then it stops with the samples solved so far and nothing is recorded', async () => {
    const { user } = renderWorksheet(() => divider({ ...onePercent, limits }));
    const view = await openView(user, 'Variation');
    const run = within(view).getByRole('form', { name: 'Monte Carlo run' });
    await fill(user, run, { Samples: '100000' });
    await user.click(within(run).getByRole('button', { name: 'Run Monte Carlo' }));
    const bar = await within(view).findByRole('progressbar', { name: 'Monte Carlo progress' });
    await waitFor(() => expect(Number(bar.getAttribute('aria-valuenow'))).toBeGreaterThan(0));
    expect(within(run).getByRole('button', { name: 'Run Monte Carlo' })).toHaveProperty(
      'disabled',
      true,
    );
    await user.click(within(run).getByRole('button', { name: 'Cancel' }));

    const status = await within(view).findByText(/^Cancelled after \d+ of 100000 samples/);
    const done = Number(/after (\d+)/.exec(status.textContent ?? '')?.[1]);
    expect(done).toBeGreaterThan(0);
    expect(done).toBeLessThan(100_000);
    expect(within(view).queryByRole('progressbar')).toBeNull();
    expect(within(view).queryByTestId('monte-carlo-result')).toBeNull();
    expect(screen.getByRole('button', { name: 'Undo' })).toHaveProperty('disabled', true);
  });

  it('when the samples are not a whole number in range, then the run does not start and says why', async () => {
    const { user } = renderWorksheet(() => divider({ ...onePercent, limits }));
    const view = await openView(user, 'Variation');
    const run = within(view).getByRole('form', { name: 'Monte Carlo run' });
    await fill(user, run, { Samples: '200001' });
    await user.click(within(run).getByRole('button', { name: 'Run Monte Carlo' }));
    expect(await within(run).findByText('At most 100000 samples.')).toBeDefined();
    await fill(user, run, { Samples: '2.5k' });
    await user.click(within(run).getByRole('button', { name: 'Run Monte Carlo' }));
    expect(await within(run).findByText('Enter a whole number of samples.')).toBeDefined();
    expect(within(view).queryByRole('progressbar')).toBeNull();
  });
});

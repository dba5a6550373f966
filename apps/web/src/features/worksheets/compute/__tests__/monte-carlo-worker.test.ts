import { runMonteCarlo } from '@biasproof/calc';
import { beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import type {
  MonteCarloFromWorker,
  MonteCarloRequest,
  MonteCarloToWorker,
} from '@/features/worksheets/compute/monte-carlo-messages.ts';
import { createWorkerRunner } from '@/features/worksheets/compute/monte-carlo-runner.ts';
import {
  divider,
  onePercent,
} from '@/features/worksheets/components/variation/__tests__/variation-test-kit.ts';

const draft = divider(onePercent);
const request = (samples: number, seed = 'w-1'): MonteCarloRequest => ({
  circuit: draft.circuit,
  settings: draft.settings,
  parameters: onePercent.parameters!,
  probes: ['nodes.out'],
  limits: [{ path: 'nodes.out', min: 4.97, max: 5.03, unit: 'V' }],
  samples,
  seed,
});

/** The worker's script, loaded into this test's global scope with postMessage captured. */
const posted: MonteCarloFromWorker[] = [];
beforeAll(() => import('@/features/worksheets/compute/monte-carlo.worker.ts'));
// The test setup unstubs globals after each test.
beforeEach(() => vi.stubGlobal('postMessage', (m: MonteCarloFromWorker) => posted.push(m)));
const send = (message: MonteCarloToWorker) =>
  globalThis.dispatchEvent(new MessageEvent('message', { data: message }));
const answer = (id: number) =>
  vi.waitFor(
    () => {
      const done = posted.find((m) => m.id === id && m.type !== 'progress');
      if (!done) throw new Error(`run ${id} has not answered`);
      return done;
    },
    { timeout: 20_000 },
  );

describe('the Monte Carlo worker', () => {
  it('when a run starts, then it reports progress in chunks and answers the engine’s result', async () => {
    send({ type: 'start', id: 1, request: request(500) });
    const done = await answer(1);
    const progress = posted.filter((m) => m.id === 1 && m.type === 'progress');
    expect(progress.map((m) => (m.type === 'progress' ? m.progress.done : 0))).toEqual(
      Array.from({ length: 50 }, (_, i) => (i + 1) * 10),
    );
    expect(done).toEqual({ type: 'done', id: 1, result: runMonteCarlo(request(500)) });
  });

  it('when a cancel arrives during a run, then the run ends with the samples solved so far', async () => {
    send({ type: 'start', id: 2, request: request(100_000) });
    await vi.waitFor(() =>
      expect(posted.some((m) => m.id === 2 && m.type === 'progress')).toBe(true),
    );
    send({ type: 'cancel', id: 2 });
    const done = await answer(2);
    if (done.type !== 'done') throw new Error(`expected a result, got ${done.type}`);
    expect(done.result.status).toBe('cancelled');
    expect(done.result.samples).toBeGreaterThan(0);
    expect(done.result.samples).toBeLessThan(100_000);
  });

  it('when the engine rejects the run, then the worker answers its message', async () => {
    send({ type: 'start', id: 3, request: { ...request(10), probes: ['node.out'], limits: [] } });
    expect(await answer(3)).toMatchObject({
      type: 'error',
      message: expect.stringMatching(/node\.out/),
    });
  });
});

class FakeWorker {
  static last: FakeWorker | null = null;
  sent: MonteCarloToWorker[] = [];
  terminated = false;
  private listeners = new Map<string, ((e: unknown) => void)[]>();
  constructor() {
    FakeWorker.last = this;
  }
  addEventListener(type: string, listener: (e: unknown) => void) {
    this.listeners.set(type, [...(this.listeners.get(type) ?? []), listener]);
  }
  postMessage(message: MonteCarloToWorker) {
    this.sent.push(message);
  }
  terminate() {
    this.terminated = true;
  }
  emit(type: string, event: unknown) {
    for (const listener of this.listeners.get(type) ?? []) listener(event);
  }
}

describe('the page side of the worker', () => {
  it('when the worker reports, then progress, result, cancel and a crash reach the right run', async () => {
    vi.stubGlobal('Worker', FakeWorker);
    const runner = createWorkerRunner();
    const seen: number[] = [];
    const first = runner.run(request(100), (p) => seen.push(p.done));
    const worker = FakeWorker.last!;
    expect(worker.sent).toEqual([{ type: 'start', id: 1, request: request(100) }]);
    worker.emit('message', {
      data: { type: 'progress', id: 1, progress: { done: 40, total: 100, failed: 0 } },
    });
    first.cancel();
    expect(worker.sent.at(-1)).toEqual({ type: 'cancel', id: 1 });
    const result = runMonteCarlo(request(100));
    worker.emit('message', { data: { type: 'done', id: 1, result } });
    await expect(first.result).resolves.toBe(result);
    expect(seen).toEqual([40]);

    const second = runner.run(request(100), () => undefined);
    worker.emit('error', new Event('error'));
    await expect(second.result).rejects.toThrow('The Monte Carlo worker stopped.');
    runner.run(request(100), () => undefined).result.catch(() => undefined);
    const restarted = FakeWorker.last!;
    expect(restarted).not.toBe(worker);
    runner.dispose();
    expect(restarted.terminated).toBe(true);
  });
});

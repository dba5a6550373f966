import { screen, waitFor, within } from '@testing-library/react';
import { circuitSchema, parseDeck, solveOperatingPoint } from '@biasproof/calc';
import { afterEach, describe, expect, it, vi } from 'vitest';
import {
  circuitPanel,
  elementRow,
  expectResult,
  queryElementRow,
  renderWorksheet,
  type User,
} from '@/features/worksheets/components/__tests__/worksheet-test-kit.tsx';
import { starterDraft } from '@/features/worksheets/draft/starter-draft.ts';

const badDeck = `Clamp with a typo
V1 in 0 DC 9
R1 in out 2k2
R2 out 0 4x7
D1 out 0 DFAST
.model DFAST D (IS=2n N=1.9)
.end
`;

const goodDeck = `Two-diode clamp
* supply and feed
V1 in 0 DC 9
R1 in out 2k2
D1 out mid DFAST
D2 mid 0 DFAST
.model DFAST D (IS=2n N=1.9 RS=0.5)
.tran 1n 1u
.op
.end
`;

function deckInput(): HTMLInputElement {
  return screen.getByLabelText('Import a SPICE deck (.cir, .sp, .net)');
}

async function importDeck(user: User, text: string, name: string) {
  await user.upload(deckInput(), new File([text], name, { type: 'text/plain' }));
}

/** Captures what "Export deck" would download. */
function captureDownloads() {
  const blobs: Blob[] = [];
  // jsdom has no object URLs; the page only needs one to hand to the link.
  Object.assign(URL, {
    createObjectURL: (blob: Blob) => {
      blobs.push(blob);
      return `blob:deck-${blobs.length}`;
    },
    revokeObjectURL: () => undefined,
  });
  const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
  return { blobs, click };
}

afterEach(() => {
  vi.restoreAllMocks();
  const patched = URL as unknown as Record<string, unknown>;
  delete patched.createObjectURL;
  delete patched.revokeObjectURL;
});

describe('SPICE decks', () => {
  it('when a deck has an error, then its line is named and nothing changes; a good deck then replaces the circuit', async () => {
    const { user } = renderWorksheet();
    expect(elementRow('R1').textContent).toContain('1 kΩ');

    await importDeck(user, badDeck, 'clamp.cir');
    const problem = await screen.findByText(
      'clamp.cir was not imported; the circuit is unchanged.',
    );
    const report = problem.closest<HTMLElement>('[role="alert"]')!;
    expect(report.textContent).toContain('Line 4:');
    expect(report.textContent).toContain('4x7');
    expect(elementRow('R1').textContent).toContain('1 kΩ');
    expect(queryElementRow('R2')).toBeNull();
    expect(within(circuitPanel()).getByLabelText('Block title')).toHaveProperty(
      'value',
      'Diode bias network',
    );

    await importDeck(user, goodDeck, 'clamp-fixed.cir');
    expect(await screen.findByText('Imported clamp-fixed.cir: 4 elements.')).toBeDefined();
    expect(
      screen.getByText(/Line 8: \.tran is not supported by the engine; ignored/),
    ).toBeDefined();
    expect(elementRow('R1').textContent).toContain('2.2 kΩ');
    expect(elementRow('D2').textContent).toContain('DFAST');
    expect(within(circuitPanel()).getByLabelText('Block title')).toHaveProperty(
      'value',
      'Two-diode clamp',
    );

    const engine = solveOperatingPoint(parseDeck(goodDeck).circuit);
    await expectResult('nodes.mid', engine.nodes.mid!, 'V');
    await expectResult('nodes.out', engine.nodes.out!, 'V');
  });

  it('when the circuit is exported and the deck imported again, then the circuit is the same', async () => {
    const { blobs, click } = captureDownloads();
    const { user } = renderWorksheet();
    await user.click(screen.getByRole('button', { name: 'Export deck' }));
    expect(click).toHaveBeenCalledOnce();
    const link = click.mock.contexts[0] as HTMLAnchorElement;
    expect(link.download).toBe('diode-bias-network.cir');
    const first = await blobs[0]!.text();
    expect(circuitSchema.parse(parseDeck(first).circuit)).toEqual(
      circuitSchema.parse(starterDraft().circuit),
    );

    await user.click(screen.getByRole('button', { name: 'Clear circuit' }));
    await waitFor(() => expect(queryElementRow('R1')).toBeNull());
    await importDeck(user, first, 'diode-bias-network.cir');
    expect(await screen.findByText('Imported diode-bias-network.cir: 3 elements.')).toBeDefined();

    await user.click(screen.getByRole('button', { name: 'Export deck' }));
    const second = await blobs[1]!.text();
    expect(second).toBe(first);
  });
});

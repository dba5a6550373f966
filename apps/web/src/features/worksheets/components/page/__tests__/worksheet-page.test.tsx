import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { WorksheetDraft } from '@biasproof/calc';
import { updateWorksheetRequestSchema, type Role, type WorksheetListItem } from '@biasproof/shared';
import {
  aWorksheet,
  worksheetId,
  type WireWorksheet,
} from '@/features/worksheets/components/__tests__/stored-worksheet-kit.ts';
import {
  circuitPanel,
  elementRow,
  fill,
  submit,
  type User,
} from '@/features/worksheets/components/__tests__/worksheet-test-kit.tsx';
import { starterDraft } from '@/features/worksheets/draft/starter-draft.ts';
import {
  apiError,
  CSRF_TOKEN,
  list,
  meOf,
  orgs,
  stubApi,
  type FakeAnswer,
} from '@/test/fake-api.ts';
import { renderApp } from '@/test/render-app.tsx';

const path = `/o/resonant-labs/worksheets/${worksheetId}`;
const patchPath = `PATCH /api/orgs/org-resonant/worksheets/${worksheetId}`;

interface ServerOptions {
  roles?: Role[];
  overrides?: Partial<WorksheetListItem>;
  /** Each PATCH waits for this before it is answered. */
  gate?: Promise<void>;
  /** Answers a PATCH instead of the normal save (return null to save normally). */
  onPatch?: (attempt: number) => FakeAnswer | Promise<FakeAnswer> | null;
}

/** One stored worksheet (revision A of the starter circuit) that PATCH saves like the server. */
function worksheetServer({
  roles = ['author'],
  overrides = {},
  gate,
  onPatch,
}: ServerOptions = {}) {
  let stored: WireWorksheet = aWorksheet(starterDraft(), { version: 1, ...overrides });
  let attempts = 0;
  const api = stubApi({
    'GET /api/auth/me': () => ({ status: 200, body: meOf({}, [{ ...orgs.resonant, roles }]) }),
    'GET /api/orgs/org-resonant/worksheets/:id': () => ({ status: 200, body: stored }),
    'GET /api/orgs/org-resonant/models': () => ({ status: 200, body: list([]) }),
    [`PATCH /api/orgs/org-resonant/worksheets/:id`]: async ({ body }) => {
      attempts += 1;
      await gate;
      const special = await onPatch?.(attempts);
      if (special) return special;
      const input = updateWorksheetRequestSchema.parse(body);
      if (input.version !== stored.version) {
        return apiError(409, 'stale-version', 'Saved by someone else.', {
          version: String(stored.version),
        });
      }
      const draft = { circuit: input.circuit, settings: input.settings } as WorksheetDraft;
      stored = aWorksheet(draft, { ...overrides, version: stored.version + 1 }, 'b2'.repeat(32));
      return { status: 200, body: stored };
    },
  });
  return {
    api,
    /** Someone else saves a new version on the server. */
    saveTheirs(draft: WorksheetDraft) {
      stored = aWorksheet(draft, { ...overrides, version: stored.version + 1 }, 'c3'.repeat(32));
    },
  };
}

function saveStatus(): HTMLElement {
  return screen.getByRole('status', { name: /^Save status/ });
}

function resultsPanel(): HTMLElement {
  return screen.getByRole('region', { name: 'Results' });
}

/** Changes R1 through its form. */
async function setR1(user: User, value: string) {
  await user.click(within(elementRow('R1')).getByRole('button', { name: 'Edit R1' }));
  const form = within(circuitPanel()).getByRole('region', { name: 'Edit R1' });
  await fill(user, form, { 'Resistance (Ω)': value });
  await submit(user, form, 'Save changes');
}

function draftWithR1(ohms: number): WorksheetDraft {
  const draft = starterDraft();
  draft.circuit.elements = draft.circuit.elements.map((el) =>
    el.name === 'R1' && el.kind === 'R' ? { ...el, value: ohms } : el,
  );
  return draft;
}

describe('a saved worksheet in the editor', () => {
  it('when the author edits, then the draft is previewed, autosaved with its version and the stored results return', async () => {
    let release = () => undefined as void;
    const gate = new Promise<void>((resolve) => (release = resolve));
    const { api } = worksheetServer({ gate });
    const user = userEvent.setup();
    renderApp(path);

    expect(
      await screen.findByRole('heading', { level: 1, name: 'Input clamp, channel A' }),
    ).toBeDefined();
    await waitFor(() => expect(within(resultsPanel()).getByText('Stored results')).toBeDefined());
    expect(within(resultsPanel()).getByTestId('stored-from').textContent).toMatch(
      /Revision A · engine .* · hash a1a1a1a1a1a1/,
    );
    expect(saveStatus().textContent).toBe('Saved');

    await setR1(user, '2k2');
    expect(within(resultsPanel()).getByText('Local preview')).toBeDefined();
    await waitFor(() => expect(saveStatus().textContent).toBe('Saving…'), { timeout: 4000 });
    expect(within(resultsPanel()).getByText('Local preview')).toBeDefined();
    release();

    await waitFor(() => expect(saveStatus().textContent).toBe('Saved'), { timeout: 4000 });
    const [patch] = api.requestsTo(patchPath);
    expect(patch?.headers['x-csrf-token']).toBe(CSRF_TOKEN);
    const sent = updateWorksheetRequestSchema.parse(patch?.body);
    expect(sent.version).toBe(1);
    expect(sent.circuit?.elements.find((el) => el.name === 'R1')).toMatchObject({ value: 2200 });
    await waitFor(() => expect(within(resultsPanel()).getByText('Stored results')).toBeDefined());
    expect(within(resultsPanel()).getByTestId('stored-from').textContent).toMatch(/hash b2b2b2/);

    // Undo goes back to revision A's circuit: a new save, now with version 2.
    await user.click(screen.getByRole('button', { name: 'Undo' }));
    await waitFor(() => expect(api.requestsTo(patchPath)).toHaveLength(2), { timeout: 4000 });
    expect(updateWorksheetRequestSchema.parse(api.requestsTo(patchPath)[1]?.body).version).toBe(2);
    await waitFor(() => expect(saveStatus().textContent).toBe('Saved'));
  });

  it('when someone else saved first, then "Keep mine as a new save" saves over their version', async () => {
    const server = worksheetServer();
    const user = userEvent.setup();
    renderApp(path);
    await screen.findByRole('heading', { level: 1, name: 'Input clamp, channel A' });
    server.saveTheirs(draftWithR1(3300));

    await setR1(user, '2k2');
    const dialog = await screen.findByRole(
      'alertdialog',
      { name: 'Someone else saved this worksheet' },
      { timeout: 4000 },
    );
    expect(saveStatus().textContent).toBe('Conflict');
    expect(server.api.requestsTo(patchPath)).toHaveLength(1);

    await user.click(within(dialog).getByRole('button', { name: 'Keep mine as a new save' }));
    await waitFor(() => expect(saveStatus().textContent).toBe('Saved'));
    const second = updateWorksheetRequestSchema.parse(server.api.requestsTo(patchPath)[1]?.body);
    expect(second.version).toBe(2);
    expect(second.circuit?.elements.find((el) => el.name === 'R1')).toMatchObject({ value: 2200 });
    expect(screen.queryByRole('alertdialog')).toBeNull();
    expect(elementRow('R1').textContent).toContain('2.2 kΩ');
  });

  it('when someone else saved first, then "Load their version" drops my edits and shows theirs', async () => {
    const server = worksheetServer();
    const user = userEvent.setup();
    renderApp(path);
    await screen.findByRole('heading', { level: 1, name: 'Input clamp, channel A' });
    server.saveTheirs(draftWithR1(3300));

    await setR1(user, '2k2');
    const dialog = await screen.findByRole(
      'alertdialog',
      { name: 'Someone else saved this worksheet' },
      { timeout: 4000 },
    );
    await user.click(within(dialog).getByRole('button', { name: 'Load their version' }));

    await waitFor(() => expect(elementRow('R1').textContent).toContain('3.3 kΩ'));
    expect(screen.queryByRole('alertdialog')).toBeNull();
    expect(saveStatus().textContent).toBe('Saved');
    await waitFor(() => expect(within(resultsPanel()).getByText('Stored results')).toBeDefined());
    expect(within(resultsPanel()).getByTestId('stored-from').textContent).toMatch(/hash c3c3c3/);
    expect(server.api.requestsTo(patchPath)).toHaveLength(1);
  });

  it('when the author leaves while a save is on its way, then the page asks first', async () => {
    worksheetServer({ onPatch: () => new Promise<FakeAnswer>(() => undefined) });
    const user = userEvent.setup();
    const { router } = renderApp(path);
    await screen.findByRole('heading', { level: 1, name: 'Input clamp, channel A' });
    await setR1(user, '2k2');
    await waitFor(() => expect(saveStatus().textContent).toBe('Saving…'), { timeout: 4000 });

    await user.click(screen.getByRole('link', { name: 'Projects' }));
    const dialog = await screen.findByRole('alertdialog', { name: 'Leave without saving?' });
    await user.click(within(dialog).getByRole('button', { name: 'Cancel' }));
    expect(router.state.location.pathname).toBe(path);
    await user.click(screen.getByRole('link', { name: 'Projects' }));
    await user.click(
      within(await screen.findByRole('alertdialog')).getByRole('button', { name: 'Leave anyway' }),
    );
    await waitFor(() => expect(router.state.location.pathname).toBe('/o/resonant-labs/projects'));
  });

  it('when someone else opens an author’s draft, then it is read-only with the stored results', async () => {
    worksheetServer({
      roles: ['author', 'checker'],
      overrides: { author: { id: 'user-tomas', name: 'Tomas Lindqvist' } },
    });
    renderApp(path);
    await screen.findByRole('heading', { level: 1, name: 'Input clamp, channel A' });
    expect(screen.getByRole('note').textContent).toBe(
      'Read only. Only its author, Tomas Lindqvist, edits this worksheet.',
    );
    expect(screen.queryByRole('status', { name: /^Save status/ })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Add part' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Edit R1' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Undo' })).toBeNull();
    expect(screen.queryByLabelText(/Import a SPICE deck/)).toBeNull();
    expect(screen.getByRole('button', { name: 'Export deck' })).toBeDefined();
    expect(screen.getByLabelText('Temperature (°C)').matches(':disabled')).toBe(true);
    await waitFor(() => expect(within(resultsPanel()).getByText('Stored results')).toBeDefined());
  });

  it('when the worksheet is in check, then even its author sees it read-only', async () => {
    worksheetServer({ overrides: { state: 'in_check' } });
    renderApp(path);
    await screen.findByRole('heading', { level: 1, name: 'Input clamp, channel A' });
    expect(screen.getByRole('note').textContent).toMatch(/This worksheet is in check/);
    expect(screen.queryByRole('button', { name: 'Add part' })).toBeNull();
  });
});

import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { transitionRequestSchema } from '@biasproof/shared';
import {
  aFinding,
  reviewServer,
  worksheetId,
  worksheetPath,
} from '@/features/review/components/__tests__/review-server.ts';
import { renderApp } from '@/test/render-app.tsx';

const base = `/api/orgs/org-resonant`;
vi.setConfig({ testTimeout: 20_000 });

/** A major finding raised on revision A whose number moved in revision B. */
const carried = aFinding({
  id: 'finding-7',
  revision: 'A',
  carried: true,
  pinnedValue: 4.3e-3,
  currentValue: 3.9e-3,
  valueChanged: true,
});

async function openFinding() {
  await screen.findByRole(
    'heading',
    { level: 1, name: 'Input clamp, channel A' },
    { timeout: 10_000 },
  );
  return screen.findByRole('article', { name: 'Major finding, open, on devices.d1.id' });
}

describe('the author answers the findings of a returned worksheet', () => {
  it('when a carried finding’s number changed, then both numbers show with the mark, and the author answers and replies in its thread', async () => {
    const { api } = reviewServer({
      as: 'author',
      state: 'returned',
      revision: 'B',
      findings: [carried],
    });
    const user = userEvent.setup();
    renderApp(worksheetPath);
    const finding = await openFinding();

    expect(finding.textContent).toContain('carried from revision A');
    expect(finding.textContent).toMatch(/Pinned \(rev\. A\)4\.3 mA/);
    expect(finding.textContent).toMatch(/Now \(rev\. B\)3\.9 mA/);
    expect(within(finding).getByText('Number changed')).toBeDefined();
    // The author raises nothing and closes nothing.
    expect(within(finding).queryByRole('button', { name: 'Close finding' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'New finding' })).toBeNull();
    expect(screen.queryByRole('button', { name: /raise a finding on/ })).toBeNull();

    await user.click(within(finding).getByRole('button', { name: 'Answer' }));
    expect(await within(finding).findByText('Write your answer.')).toBeDefined();
    await user.type(within(finding).getByLabelText('Your answer or reply'), 'R1 is now 1k2.');
    await user.click(within(finding).getByRole('button', { name: 'Answer' }));

    const answered = await screen.findByRole('article', {
      name: 'Major finding, answered, on devices.d1.id',
    });
    expect(within(answered).getByRole('list', { name: 'Thread' }).textContent).toMatch(
      /Answered by Ines Okafor, 2026-12-01 09:00 Europe\/Berlin \(GMT\+01:00\)R1 is now 1k2\./,
    );
    expect(api.requestsTo(`POST ${base}/findings/finding-7/answer`)[0]?.body).toEqual({
      text: 'R1 is now 1k2.',
    });

    await user.type(within(answered).getByLabelText('Your comment'), 'Datasheet attached.');
    await user.click(within(answered).getByRole('button', { name: 'Reply' }));
    await waitFor(() =>
      expect(within(answered).getByRole('list', { name: 'Thread' }).textContent).toContain(
        'Replied by Ines Okafor',
      ),
    );
    expect(api.requestsTo(`POST ${base}/findings/finding-7/replies`)).toHaveLength(1);
  });

  it('when the author attaches files to a finding, then a too-large or refused file is said clearly and a PDF lands in its list', async () => {
    const { api } = reviewServer({
      as: 'author',
      state: 'returned',
      revision: 'B',
      findings: [carried],
    });
    // The picker's type list is a hint: a person can still choose "all files".
    const user = userEvent.setup({ applyAccept: false });
    renderApp(worksheetPath);
    const finding = await openFinding();
    const input = within(finding).getByLabelText('Attach a file to the finding on devices.d1.id');

    const huge = new File(['%PDF-1.7'], 'scope-capture.pdf', { type: 'application/pdf' });
    Object.defineProperty(huge, 'size', { value: 21 * 1024 * 1024 });
    await user.upload(input, huge);
    expect((await within(finding).findByRole('alert')).textContent).toBe(
      'scope-capture.pdf is 21.0 MB; files up to 20.0 MB are accepted.',
    );
    expect(api.requestsTo(`POST ${base}/worksheets/${worksheetId}/attachments`)).toHaveLength(0);

    await user.upload(input, new File(['<svg/>'], 'sketch.svg', { type: 'image/svg+xml' }));
    expect((await within(finding).findByRole('alert')).textContent).toBe(
      'sketch.svg was not attached: sketch.svg is an SVG image; attach PDF, PNG, JPEG, CSV or a SPICE deck.',
    );

    await user.upload(input, new File(['%PDF-1.7 datasheet'], 'd1-datasheet.pdf'));
    const link = await within(finding).findByRole('link', { name: 'd1-datasheet.pdf' });
    expect(link.getAttribute('href')).toBe('/api/orgs/org-resonant/attachments/att-1');
    expect(within(finding).getByText('Attached d1-datasheet.pdf.')).toBeDefined();
    const sent = api.fetchMock.mock.calls.find(([, init]) => init?.body instanceof FormData)?.[1];
    expect(sent?.headers).toMatchObject({ 'x-csrf-token': 'csrf-token-of-this-session' });
    expect((sent?.body as FormData).get('findingId')).toBe('finding-7');
  });

  it('when someone changed the worksheet since the page read it, then the step is refused, the person is told and the page reloads', async () => {
    const { api, state } = reviewServer({ as: 'author', state: 'returned', revision: 'B' });
    const user = userEvent.setup();
    renderApp(worksheetPath);
    const steps = await screen.findByRole('list', { name: 'Workflow steps' }, { timeout: 10_000 });
    const reads = api.requestsTo(`GET ${base}/worksheets/${worksheetId}`).length;
    state.version += 1;

    await user.click(within(steps).getByRole('button', { name: 'Submit for check' }));
    const dialog = await screen.findByRole('dialog', { name: 'Submit revision B for check?' });
    expect(dialog.textContent).toContain('Tomas Lindqvist is asked to check it.');
    await user.click(within(dialog).getByRole('button', { name: 'Submit for check' }));

    expect((await screen.findByRole('alert')).textContent).toMatch(
      /Someone changed this worksheet after this page read it/,
    );
    await waitFor(() =>
      expect(api.requestsTo(`GET ${base}/worksheets/${worksheetId}`).length).toBeGreaterThan(reads),
    );
    await user.click(
      within(await screen.findByRole('list', { name: 'Workflow steps' })).getByRole('button', {
        name: 'Submit for check',
      }),
    );
    await user.click(
      within(await screen.findByRole('dialog')).getByRole('button', { name: 'Submit for check' }),
    );
    expect(await screen.findByText('Revision B was submitted for check.')).toBeDefined();
    const sent = api.requestsTo(`POST ${base}/worksheets/${worksheetId}/transitions`);
    expect(sent.map((r) => transitionRequestSchema.parse(r.body).version)).toEqual([3, 4]);
  });

  it('when no checker is assigned, then submit is shown disabled with the reason', async () => {
    reviewServer({ as: 'author', state: 'draft', checker: null });
    renderApp(worksheetPath);
    const steps = await screen.findByRole('list', { name: 'Workflow steps' }, { timeout: 10_000 });
    const submit = within(steps).getByRole('button', { name: 'Submit for check' });
    expect(submit.matches(':disabled')).toBe(true);
    expect(
      document.getElementById(submit.getAttribute('aria-describedby') ?? '')?.textContent,
    ).toBe('Assign a checker and an approver before submitting this worksheet.');
    expect(within(steps).getByRole('button', { name: 'Withdraw' }).matches(':enabled')).toBe(true);
  });

  it('when the author assigns a checker, then the assignment is saved with the version and submit is no longer blocked', async () => {
    const { api } = reviewServer({ as: 'author', state: 'draft', checker: null });
    const user = userEvent.setup();
    renderApp(worksheetPath);
    await screen.findByRole('list', { name: 'Workflow steps' }, { timeout: 10_000 });
    expect(screen.getByText(/Checker:/).textContent).toBe('Checker: not assigned');

    await user.click(screen.getByRole('button', { name: 'Assign checker and approver' }));
    const dialog = await screen.findByRole('dialog', { name: 'Checker and approver' });
    const checker = within(dialog).getByLabelText<HTMLSelectElement>('Checker');
    // Only checkers, never the author.
    expect([...checker.options].map((o) => o.text)).toEqual(['Nobody yet', 'Tomas Lindqvist']);
    await user.selectOptions(checker, 'Tomas Lindqvist');
    await user.click(within(dialog).getByRole('button', { name: 'Save assignment' }));

    expect(await screen.findByText('The checker and approver are saved.')).toBeDefined();
    expect(api.requestsTo(`PATCH ${base}/worksheets/${worksheetId}`)[0]?.body).toEqual({
      version: 3,
      checkerId: 'user-tomas',
      approverId: 'user-priya',
    });
    await waitFor(() =>
      expect(screen.getByText(/Checker:/).textContent).toBe('Checker: Tomas Lindqvist'),
    );
    const steps = await screen.findByRole('list', { name: 'Workflow steps' });
    await waitFor(() =>
      expect(
        within(steps).getByRole('button', { name: 'Submit for check' }).matches(':enabled'),
      ).toBe(true),
    );
  });
});

import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { createFindingRequestSchema, transitionRequestSchema } from '@biasproof/shared';
import {
  reviewServer,
  worksheetPath,
} from '@/features/review/components/__tests__/review-server.ts';
import { renderApp } from '@/test/render-app.tsx';

const base = '/api/orgs/org-resonant';
// The worksheet page and the engine load on first use: a cold start takes a few seconds.
vi.setConfig({ testTimeout: 20_000 });

/** The page, its code loaded lazily (slow on a cold start), and its workflow steps. */
async function openWorksheet() {
  await screen.findByRole(
    'heading',
    { level: 1, name: 'Input clamp, channel A' },
    { timeout: 10_000 },
  );
  return screen.findByRole('list', { name: 'Workflow steps' });
}

function numberButton(path: string, extra = '') {
  return screen.findByRole('button', {
    name: new RegExp(`raise a finding on ${path.replace(/\./g, '\\.')}${extra}`),
  });
}

describe('a checker reviews a submitted revision', () => {
  it('when the checker clicks a number and raises a major finding, then it is pinned and marked, and accept is blocked with the reason', async () => {
    const { api } = reviewServer({ as: 'checker', state: 'in_check' });
    const user = userEvent.setup();
    renderApp(worksheetPath);
    const steps = await openWorksheet();
    expect(within(steps).getByRole('button', { name: 'Accept' }).matches(':enabled')).toBe(true);
    expect(within(steps).getByRole('button', { name: 'Return to author' })).toBeDefined();
    expect(within(steps).queryByRole('button', { name: 'Submit for check' })).toBeNull();
    expect(within(steps).queryByRole('button', { name: 'Sign off…' })).toBeNull();

    await user.click(await numberButton('devices.d1.id'));
    const dialog = await screen.findByRole('dialog', { name: 'Raise a finding on revision A' });
    const path = within(dialog).getByLabelText<HTMLInputElement>('Number or input (path)');
    expect(path.value).toBe('devices.d1.id');
    expect(dialog.textContent).toMatch(/Shown in the results as 4\.\d+ mA/);
    expect(document.activeElement).toBe(within(dialog).getByLabelText('What is wrong'));

    await user.click(within(dialog).getByRole('button', { name: 'Raise finding' }));
    expect(await within(dialog).findByText('Describe the finding.')).toBeDefined();
    expect(
      api.requestsTo(`POST ${base}/worksheets/${'5e0c7a1d-2b3c-4d5e-8f90-a1b2c3d4e5f6'}/findings`),
    ).toHaveLength(0);

    await user.click(within(dialog).getByRole('radio', { name: /^Major/ }));
    await user.type(within(dialog).getByLabelText('What is wrong'), 'Above the 1N4148 rating?');
    await user.click(within(dialog).getByRole('button', { name: 'Raise finding' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());

    const [raised] = api.requestsTo(
      `POST ${base}/worksheets/5e0c7a1d-2b3c-4d5e-8f90-a1b2c3d4e5f6/findings`,
    );
    expect(createFindingRequestSchema.parse(raised?.body)).toEqual({
      path: 'devices.d1.id',
      severity: 'major',
      text: 'Above the 1N4148 rating?',
    });
    const panel = screen.getByRole('region', { name: 'Review' });
    const finding = await within(panel).findByRole('article', {
      name: 'Major finding, open, on devices.d1.id',
    });
    expect(finding.textContent).toContain('Above the 1N4148 rating?');
    expect(finding.textContent).toMatch(/Pinned \(rev\. A\)4\.3 mA/);
    // The number now carries a visible flag and says so to assistive technology.
    expect(await numberButton('devices.d1.id', '.*1 finding: 1 open')).toBeDefined();

    const accept = within(steps).getByRole('button', { name: 'Accept' });
    await waitFor(() => expect(accept.matches(':disabled')).toBe(true));
    const reason = document.getElementById(accept.getAttribute('aria-describedby') ?? '');
    expect(reason?.textContent).toBe(
      '1 major finding is still open; close them before accepting or signing off.',
    );
  });

  it('when the checker focuses a number and presses Enter or Space, then the raise form opens for it', async () => {
    // Checked: the approver's turn, yet the checker may still raise findings on it.
    reviewServer({ as: 'checker', state: 'checked' });
    const user = userEvent.setup();
    renderApp(worksheetPath);
    await screen.findByRole(
      'heading',
      { level: 1, name: 'Input clamp, channel A' },
      { timeout: 10_000 },
    );

    (await numberButton('nodes.out')).focus();
    await user.keyboard('{Enter}');
    let dialog = await screen.findByRole('dialog', { name: 'Raise a finding on revision A' });
    expect(within(dialog).getByLabelText<HTMLInputElement>('Number or input (path)').value).toBe(
      'nodes.out',
    );
    await user.keyboard('{Escape}');
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(document.activeElement).toBe(await numberButton('nodes.out'));

    await user.keyboard(' ');
    dialog = await screen.findByRole('dialog', { name: 'Raise a finding on revision A' });
    expect(within(dialog).getByLabelText<HTMLInputElement>('Number or input (path)').value).toBe(
      'nodes.out',
    );
  });

  it('when the checker returns the revision, then a comment is asked and the step is sent with the version', async () => {
    const { api } = reviewServer({ as: 'checker', state: 'in_check' });
    const user = userEvent.setup();
    renderApp(worksheetPath);
    const steps = await openWorksheet();

    await user.click(within(steps).getByRole('button', { name: 'Return to author' }));
    const dialog = await screen.findByRole('dialog', { name: 'Return revision A to Ines Okafor?' });
    expect(dialog.textContent).toContain('gets revision A back with its open findings');
    await user.click(within(dialog).getByRole('button', { name: 'Return to author' }));
    expect(await within(dialog).findByText('Say why, in a few words.')).toBeDefined();

    await user.type(within(dialog).getByLabelText('Comment'), 'See the finding on D1.');
    await user.click(within(dialog).getByRole('button', { name: 'Return to author' }));

    expect(await screen.findByText('Revision A was returned to Ines Okafor.')).toBeDefined();
    const [step] = api.requestsTo(
      `POST ${base}/worksheets/5e0c7a1d-2b3c-4d5e-8f90-a1b2c3d4e5f6/transitions`,
    );
    expect(transitionRequestSchema.parse(step?.body)).toEqual({
      action: 'return',
      version: 3,
      comment: 'See the finding on D1.',
    });
    // The page started afresh from the server: returned, and no step is the checker's now.
    expect(await screen.findByText('Returned')).toBeDefined();
    expect(
      await screen.findByText('No workflow step is yours on this worksheet now.'),
    ).toBeDefined();
    expect(screen.queryByRole('button', { name: /raise a finding on/ })).toBeNull();
  });
});

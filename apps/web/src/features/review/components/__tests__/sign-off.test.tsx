import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { transitionRequestSchema } from '@biasproof/shared';
import {
  reviewServer,
  RIGHT_PASSWORD,
  worksheetId,
  worksheetPath,
} from '@/features/review/components/__tests__/review-server.ts';
import { renderApp } from '@/test/render-app.tsx';

vi.setConfig({ testTimeout: 20_000 });
const transitions = `POST /api/orgs/org-resonant/worksheets/${worksheetId}/transitions`;

describe('the approver signs off a checked revision', () => {
  it('when the approver signs, then the dialog previews the manifestation, a wrong password keeps it open, and the signature shows on the page', async () => {
    const { api } = reviewServer({ as: 'approver', state: 'checked' });
    const user = userEvent.setup();
    renderApp(worksheetPath);
    const steps = await screen.findByRole('list', { name: 'Workflow steps' }, { timeout: 10_000 });
    expect(within(steps).getByRole('button', { name: 'Return to author' })).toBeDefined();
    // The approver raises no findings and does not accept.
    expect(within(steps).queryByRole('button', { name: 'Accept' })).toBeNull();
    expect(screen.queryByRole('button', { name: /raise a finding on/ })).toBeNull();

    await user.click(within(steps).getByRole('button', { name: 'Sign off…' }));
    const dialog = await screen.findByRole('dialog', { name: 'Sign off revision A' });
    const meaning = within(dialog).getByLabelText<HTMLSelectElement>('Meaning of your signature');
    expect(document.activeElement).toBe(meaning);
    expect([...meaning.options].map((o) => o.text)).toEqual(['Reviewed', 'Approved for release']);
    const preview = within(dialog).getByRole('region', { name: 'Signature preview' });
    expect(preview.textContent).toContain('Signed byPriya Raman');
    expect(preview.textContent).toContain('MeaningReviewed');
    expect(preview.textContent).toMatch(
      /\d{4}-\d\d-\d\d \d\d:\d\d Europe\/Berlin \(GMT\+0[12]:00\)/,
    );
    expect(preview.textContent).toContain(`SHA-256 ${'a1'.repeat(32)}`);
    expect(dialog.textContent).toMatch(
      /engineering aids, not a substitute for qualified review\. Safety-related designs .* follow local codes and licensed engineering practice/,
    );

    await user.click(within(dialog).getByRole('button', { name: 'Sign revision A' }));
    expect(await within(dialog).findByText('Enter your password to sign.')).toBeDefined();
    expect(api.requestsTo(transitions)).toHaveLength(0);

    await user.selectOptions(meaning, 'Approved for release');
    expect(preview.textContent).toContain('MeaningApproved for release');
    const password = within(dialog).getByLabelText('Your password');
    await user.type(password, 'not-my-password');
    await user.click(within(dialog).getByRole('button', { name: 'Sign revision A' }));
    expect(
      await within(dialog).findByText('That is not your password; nothing was signed.'),
    ).toBeDefined();
    expect(screen.getByRole('dialog', { name: 'Sign off revision A' })).toBe(dialog);
    expect(password.getAttribute('aria-invalid')).toBe('true');

    await user.clear(password);
    await user.type(password, RIGHT_PASSWORD);
    await user.click(within(dialog).getByRole('button', { name: 'Sign revision A' }));
    expect(await screen.findByText('Revision A is signed off.')).toBeDefined();
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(transitionRequestSchema.parse(api.requestsTo(transitions)[1]?.body)).toEqual({
      action: 'sign',
      version: 3,
      meaning: 'Approved for release',
      password: RIGHT_PASSWORD,
    });

    const signature = await screen.findByRole('figure', { name: 'Signature of Priya Raman' });
    expect(signature.textContent).toContain('Signed electronically: Approved for release');
    expect(signature.textContent).toContain('2026-12-01 14:05 Europe/Berlin (GMT+01:00)');
    expect(signature.textContent).toContain(`SHA-256 ${'a1'.repeat(32)}`);
    expect(screen.getByText('Signed off')).toBeDefined();
  });

  it('when anyone opens a signed-off worksheet, then its signature’s manifestation is shown', async () => {
    reviewServer({
      as: 'manager',
      state: 'signed_off',
      signatures: [
        {
          id: 'sig-1',
          revision: 'A',
          signer: { id: 'user-priya', name: 'Priya Raman' },
          printedName: 'Priya Raman',
          meaning: 'Reviewed',
          contentHash: 'a1'.repeat(32),
          signedAt: '2026-07-01T08:30:00.000Z',
          supersededAt: null,
        },
      ],
    });
    renderApp(worksheetPath);
    const signature = await screen.findByRole(
      'figure',
      { name: 'Signature of Priya Raman' },
      { timeout: 10_000 },
    );
    // Summer time in Berlin: UTC+2.
    expect(signature.textContent).toContain('2026-07-01 10:30 Europe/Berlin (GMT+02:00)');
    await waitFor(() =>
      expect(screen.getByText('No workflow step is yours on this worksheet now.')).toBeDefined(),
    );
  });

  it('when the author starts a new revision of a signed-off worksheet, then it opens as an editable draft of the next letter', async () => {
    const { api } = reviewServer({ as: 'author', state: 'signed_off' });
    const user = userEvent.setup();
    renderApp(worksheetPath);
    const steps = await screen.findByRole('list', { name: 'Workflow steps' }, { timeout: 10_000 });
    expect(screen.getByRole('note').textContent).toMatch(
      /signed off: revision A can no longer change/,
    );
    expect(within(steps).queryByRole('button', { name: 'Withdraw' })).toBeNull();

    await user.click(within(steps).getByRole('button', { name: 'Start a new revision' }));
    const dialog = await screen.findByRole('dialog', { name: 'Start a revision after A?' });
    expect(dialog.textContent).toContain('stay as they are until the new one is signed');
    await user.click(within(dialog).getByRole('button', { name: 'Start new revision' }));

    expect(
      await screen.findByText('A new revision was started; you can edit it now.'),
    ).toBeDefined();
    expect(transitionRequestSchema.parse(api.requestsTo(transitions)[0]?.body)).toMatchObject({
      action: 'revise',
      version: 3,
    });
    await waitFor(() => expect(screen.queryByRole('note')).toBeNull());
    expect(screen.getByRole('status', { name: 'Save status: Saved' })).toBeDefined();
    expect(screen.getByRole('button', { name: 'Edit R1' })).toBeDefined();
  });
});

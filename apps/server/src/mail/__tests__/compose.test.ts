import { describe, expect, it } from 'vitest';
import { composeMail } from '../compose.ts';
import { invitationMail, passwordResetMail } from '../messages.ts';
import { messageIdFor, senderDomain } from '../send-mail.ts';

describe('composing e-mail in text and HTML', () => {
  it('when parts are composed, then the text and the HTML say the same things, the HTML escaped', () => {
    const { text, html } = composeMail({
      greeting: 'Hello Ada <Lab> Marsh,',
      paragraphs: [
        'Q1 & Q2 are "matched".',
        [
          '[major] nodes.out: 2.5 V < 3 V',
          { label: 'R2 value', url: 'https://app.example/w?a=1&b=2' },
        ],
      ],
      link: { url: 'https://app.example/o/lab/worksheets/1', label: 'Open the worksheet' },
      footer: 'Sent by Biasproof.',
    });

    expect(text).toBe(
      [
        'Hello Ada <Lab> Marsh,',
        'Q1 & Q2 are "matched".',
        '- [major] nodes.out: 2.5 V < 3 V\n- R2 value: https://app.example/w?a=1&b=2',
        'Open the worksheet: https://app.example/o/lab/worksheets/1',
        'Sent by Biasproof.',
      ].join('\n\n') + '\n',
    );
    expect(html).toContain('<p>Hello Ada &lt;Lab&gt; Marsh,</p>');
    expect(html).toContain('<p>Q1 &amp; Q2 are &quot;matched&quot;.</p>');
    expect(html).toContain(
      '<ul><li>[major] nodes.out: 2.5 V &lt; 3 V</li><li><a href="https://app.example/w?a=1&amp;b=2">R2 value</a></li></ul>',
    );
    expect(html).toMatch(
      /<a href="https:\/\/app\.example\/o\/lab\/worksheets\/1" style="[^"]+">Open the worksheet<\/a>/,
    );
    expect(html).toMatch(/^<!doctype html><html lang="en"><head><meta charset="utf-8">/);
  });

  it('when a link is not a web address, then the HTML shows it as text, not as an anchor', () => {
    const { html } = composeMail({
      greeting: 'Hello,',
      paragraphs: [],
      link: { url: 'javascript:alert(1)', label: 'Click' },
    });

    expect(html).not.toContain('<a ');
    expect(html).toContain('Click: javascript:alert(1)');
  });

  it('when the invitation and reset e-mails are built, then both carry their link in text and HTML', () => {
    const invitation = invitationMail({
      to: 'nia@lab.example',
      orgName: 'Lowdrift Labs',
      invitedByName: 'Ada Marsh',
      roles: ['checker', 'approver'],
      link: 'https://app.example/invitations/tok',
      expiresAt: new Date(Date.UTC(2026, 11, 8, 12)),
    });
    const reset = passwordResetMail({
      to: 'nia@lab.example',
      name: 'Nia',
      link: 'https://app.example/reset-password?token=tok',
    });

    expect(invitation.subject).toBe('Ada Marsh invited you to Lowdrift Labs on Biasproof');
    expect(invitation.text).toContain('as checker, approver');
    expect(invitation.text).toContain('Tue, 08 Dec 2026 12:00:00 GMT');
    expect(invitation.text).toContain('Accept the invitation: https://app.example/invitations/tok');
    expect(invitation.html).toContain('href="https://app.example/invitations/tok"');
    expect(reset.text).toContain(
      'Choose a new password: https://app.example/reset-password?token=tok',
    );
    expect(reset.html).toContain('href="https://app.example/reset-password?token=tok"');
  });

  it('when a message has a stable key, then its Message-ID ends in the sender domain', () => {
    expect(senderDomain('Biasproof <no-reply@biasproof.example>')).toBe('biasproof.example');
    expect(senderDomain('ops@lab.example')).toBe('lab.example');
    expect(messageIdFor('outbox.42', 'Biasproof <no-reply@biasproof.example>')).toBe(
      '<outbox.42@biasproof.example>',
    );
  });
});

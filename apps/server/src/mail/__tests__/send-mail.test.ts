import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../../test-support/test-app.ts';
import { waitForEmail } from '../../test-support/maildev.ts';

describe('sendMail through the SMTP fake', () => {
  const t = createTestApp();
  afterAll(() => t.close());

  it('when a message is sent, then maildev holds it with its subject, sender, recipient and text', async () => {
    const to = `mira.okafor.${Date.now()}@lowdrift.example`;
    const { messageId } = await t.mailer.send({
      to,
      subject: 'Worksheet LNA-3 bias check is waiting for you',
      text: 'Revision B of LNA-3 input stage is ready to check: Q1 collector current 936 µA.',
    });
    expect(messageId).toMatch(/@/);
    const mail = await waitForEmail(to, /LNA-3 bias check/);
    expect(mail.from[0]?.address).toBe('no-reply@biasproof.example');
    expect(mail.to.map((a) => a.address)).toEqual([to]);
    expect(mail.text).toContain('936 µA');
  });
});

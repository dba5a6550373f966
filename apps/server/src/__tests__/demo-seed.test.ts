import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../test-support/test-app.ts';
import { signIn, systemRows } from '../test-support/fixtures.ts';
// The demo scenario lives in the seed workspace; loading it here checks it against the real schema.
import { demoSteps } from '../../../../seed/src/demo-steps.ts';
import { DEMO_PASSWORD, demoOrganizations } from '../../../../seed/src/demo-organizations.ts';

const readme = readFileSync(new URL('../../../../README.md', import.meta.url), 'utf8');

describe('demo data', () => {
  const t = createTestApp();
  afterAll(() => t.close());

  it('when loaded twice, then the second load writes nothing', async () => {
    for (const step of demoSteps) await step.load(t.sequelize, t.config);
    const before = await systemRows(
      t,
      'SELECT (SELECT count(*) FROM users) AS users, (SELECT count(*) FROM audit_events) AS events',
    );

    const again = [];
    for (const step of demoSteps) again.push(await step.load(t.sequelize, t.config));

    expect(again.map((r) => r.loaded)).toEqual(demoSteps.map(() => false));
    expect(again[0]?.signIns.length).toBeGreaterThan(0);
    expect(
      await systemRows(
        t,
        'SELECT (SELECT count(*) FROM users) AS users, (SELECT count(*) FROM audit_events) AS events',
      ),
    ).toEqual(before);
  });

  it('when loaded, then Quietline has a worksheet in every review state, with findings, replies, signatures and an intact audit chain', async () => {
    for (const step of demoSteps) await step.load(t.sequelize, t.config);
    const states = await systemRows<{ state: string }>(
      t,
      `SELECT DISTINCT r.state FROM revisions r JOIN organizations o ON o.id = r.org_id
        WHERE o.slug = 'quietline-analog' ORDER BY 1`,
    );
    expect(states.map((r) => r.state)).toEqual([
      'checked',
      'draft',
      'in_check',
      'returned',
      'signed_off',
      'superseded',
      'withdrawn',
    ]);
    // Counted in the demo organization only: other tests share this database.
    const [counts] = await systemRows<Record<string, string>>(
      t,
      `WITH o AS (SELECT id FROM organizations WHERE slug = 'quietline-analog')
       SELECT (SELECT count(*) FROM findings WHERE org_id = (SELECT id FROM o)
                  AND severity = 'major' AND status <> 'closed') AS "openMajor",
              (SELECT count(*) FROM finding_replies WHERE org_id = (SELECT id FROM o)
                  AND kind = 'reply') AS replies,
              (SELECT count(*) FROM signatures WHERE org_id = (SELECT id FROM o)) AS signatures,
              (SELECT count(*) FROM signatures WHERE org_id = (SELECT id FROM o)
                  AND superseded_at IS NOT NULL) AS superseded`,
    );
    expect(counts).toEqual({ openMajor: '1', replies: '1', signatures: '2', superseded: '1' });

    const { agent } = await signIn(t, {
      email: 'marc.dubois@quietline.example',
      password: DEMO_PASSWORD,
    });
    const orgId = (await agent.get('/api/auth/me')).body.memberships[0].orgId as string;
    const verify = await agent.get(`/api/orgs/${orgId}/audit/verify`);
    expect(verify.status).toBe(200);
    expect(verify.body.ok).toBe(true);
    expect(verify.body.events).toBeGreaterThan(30);
  });

  it('when a demo person signs in with the demo password, then they see their organizations and roles', async () => {
    for (const step of demoSteps) await step.load(t.sequelize, t.config);
    const tomas = 'tomas.lindqvist@quietline.example';
    const { agent } = await signIn(t, { email: tomas, password: DEMO_PASSWORD });
    const me = await agent.get('/api/auth/me');
    expect(
      (me.body.memberships as { orgName: string; roles: string[] }[]).map((m) => [
        m.orgName,
        m.roles,
      ]),
    ).toEqual([
      ['Lowdrift Sensors', ['checker', 'approver']],
      ['Quietline Analog', ['author']],
    ]);
  });

  it('when the README lists the demo accounts, then the table and the password match the demo data', () => {
    const rows = [...readme.matchAll(/^\| (\S+@\S+\.example) +\| ([^|]+) \| ([^|]+) \|$/gm)].map(
      (m) => [m[1], m[2]!.trim(), m[3]!.trim()],
    );
    const expected = demoOrganizations.flatMap((o) =>
      o.members.map((m) => [m.person.email, o.name, m.roles.join(', ')]),
    );
    expect(rows).toEqual(expected);
    expect(readme).toContain(`\nDemo password: \`${DEMO_PASSWORD}\`\n`);
    const quietline = demoOrganizations.find((o) => o.slug === 'quietline-analog')!;
    expect(new Set(quietline.members.flatMap((m) => m.roles))).toEqual(
      new Set(['admin', 'author', 'checker', 'approver', 'manager']),
    );
    expect(quietline.members.every((m) => m.roles.length === 1)).toBe(true);
  });
});

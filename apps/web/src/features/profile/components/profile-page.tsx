import { Card } from '@/components/ui/card.tsx';
import { RoleChips } from '@/components/ui/role-list.tsx';
import { TextLink } from '@/components/ui/text-link.tsx';
import { ChangePasswordForm } from '@/features/profile/components/change-password-form.tsx';
import { NameForm } from '@/features/profile/components/name-form.tsx';
import { NotificationPreferencesSection } from '@/features/profile/components/notification-preferences-form.tsx';
import { orgPath } from '@/lib/current-org.tsx';
import { useSignedInMe } from '@/lib/signed-in.tsx';

/** `/profile`: the person's name, password, e-mail notifications and organizations. */
export function ProfilePage() {
  const me = useSignedInMe();
  return (
    <div className="mx-auto flex w-full max-w-3xl flex-col gap-8">
      <title>Your profile · Biasproof</title>
      <div>
        <h1 className="text-3xl font-bold text-ink-900">Your profile</h1>
        <p className="mt-2 text-ink-700">Signed in as {me.user.email}.</p>
      </div>

      <Card aria-labelledby="name-heading">
        <h2 id="name-heading" className="mb-4 text-lg font-semibold text-ink-900">
          Name
        </h2>
        <NameForm currentName={me.user.name} />
      </Card>

      <Card aria-labelledby="password-heading">
        <h2 id="password-heading" className="mb-4 text-lg font-semibold text-ink-900">
          Password
        </h2>
        <ChangePasswordForm email={me.user.email} />
      </Card>

      <Card aria-labelledby="notifications-heading">
        <h2 id="notifications-heading" className="mb-4 text-lg font-semibold text-ink-900">
          E-mail notifications
        </h2>
        <NotificationPreferencesSection />
      </Card>

      <Card aria-labelledby="orgs-heading">
        <h2 id="orgs-heading" className="mb-4 text-lg font-semibold text-ink-900">
          Your organizations
        </h2>
        {me.memberships.length === 0 ? (
          <p className="text-ink-700">
            You are not a member of any organization. An admin of one can invite you.
          </p>
        ) : (
          <ul className="flex flex-col gap-3">
            {me.memberships.map((m) => (
              <li key={m.orgId} className="flex flex-wrap items-center gap-3">
                <TextLink to={orgPath(m.orgSlug)}>{m.orgName}</TextLink>
                <RoleChips roles={m.roles} />
              </li>
            ))}
          </ul>
        )}
      </Card>
    </div>
  );
}

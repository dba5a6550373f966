import { useEffect, useId, useRef, useState, type KeyboardEvent } from 'react';
import { Link, useLocation } from 'react-router-dom';
import type { MembershipSummary } from '@biasproof/shared';
import { orgPath } from '@/lib/current-org.tsx';

interface OrgSwitcherProps {
  memberships: readonly MembershipSummary[];
  /** The organization in the address, if any. */
  currentSlug: string | undefined;
}

/** The same page in another organization: `/o/a/members` → `/o/b/members`. */
function samePageIn(pathname: string, slug: string): string {
  const rest = /^\/o\/[^/]+\/(.+)$/.exec(pathname)?.[1];
  return orgPath(slug, rest ?? '');
}

/**
 * The header's organization menu: a button that opens a list of the person's organizations.
 * Arrow keys move between them, Escape closes and returns to the button.
 */
export function OrgSwitcher({ memberships, currentSlug }: OrgSwitcherProps) {
  const [open, setOpen] = useState(false);
  const { pathname } = useLocation();
  const menuId = useId();
  const button = useRef<HTMLButtonElement>(null);
  const list = useRef<HTMLUListElement>(null);
  const current = memberships.find((m) => m.orgSlug === currentSlug);

  useEffect(() => setOpen(false), [pathname]);
  useEffect(() => {
    if (open) list.current?.querySelector<HTMLAnchorElement>('a[aria-current="page"], a')?.focus();
  }, [open]);

  function onMenuKey(event: KeyboardEvent<HTMLUListElement>) {
    const links = [...(list.current?.querySelectorAll<HTMLAnchorElement>('a') ?? [])];
    const at = links.indexOf(document.activeElement as HTMLAnchorElement);
    if (event.key === 'Escape') {
      event.preventDefault();
      setOpen(false);
      button.current?.focus();
    } else if (event.key === 'ArrowDown' || event.key === 'ArrowUp') {
      event.preventDefault();
      const step = event.key === 'ArrowDown' ? 1 : -1;
      links[(at + step + links.length) % links.length]?.focus();
    }
  }

  if (memberships.length === 0) return null;
  return (
    <div className="relative">
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={menuId}
        aria-label={`Organization: ${current?.orgName ?? 'choose one'}`}
        onClick={() => setOpen((o) => !o)}
        className="flex items-center gap-2 rounded-md border border-ink-500 px-3 py-1 text-sm font-semibold text-paper hover:bg-ink-700 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-paper"
      >
        {current?.orgName ?? 'Choose organization'}
        <span aria-hidden="true">▾</span>
      </button>
      {open ? (
        <ul
          id={menuId}
          ref={list}
          aria-label="Your organizations"
          onKeyDown={onMenuKey}
          className="absolute left-0 z-10 mt-2 min-w-56 rounded-md border border-rule bg-surface py-1 shadow-lg"
        >
          {memberships.map((m) => (
            <li key={m.orgId}>
              <Link
                to={samePageIn(pathname, m.orgSlug)}
                aria-current={m.orgSlug === currentSlug ? 'page' : undefined}
                className="block px-4 py-2 text-sm text-ink-900 hover:bg-accent-tint focus-visible:bg-accent-tint focus-visible:outline-none aria-[current=page]:font-bold"
              >
                {m.orgName}
              </Link>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

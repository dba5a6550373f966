import { useId, useRef, type KeyboardEvent, type ReactNode } from 'react';

export interface TabItem {
  id: string;
  label: ReactNode;
  /** Rendered only while the tab is selected. */
  content: () => ReactNode;
}

interface TabsProps {
  /** Accessible name of the tab list. */
  label: string;
  tabs: readonly TabItem[];
  selected: string;
  onSelect: (id: string) => void;
}

/**
 * Tabs after the WAI-ARIA pattern: arrow keys, Home and End move between tabs (and select them),
 * Tab goes into the open panel.
 */
export function Tabs({ label, tabs, selected, onSelect }: TabsProps) {
  const base = useId();
  const list = useRef<HTMLDivElement>(null);
  const current = tabs.find((t) => t.id === selected) ?? tabs[0];

  function onKeyDown(event: KeyboardEvent<HTMLDivElement>) {
    const index = tabs.findIndex((t) => t.id === current?.id);
    const last = tabs.length - 1;
    const next =
      event.key === 'ArrowRight'
        ? index === last
          ? 0
          : index + 1
        : event.key === 'ArrowLeft'
          ? index === 0
            ? last
            : index - 1
          : event.key === 'Home'
            ? 0
            : event.key === 'End'
              ? last
              : null;
    if (next === null) return;
    event.preventDefault();
    const tab = tabs[next];
    if (!tab) return;
    onSelect(tab.id);
    list.current?.ownerDocument.getElementById(`${base}-tab-${tab.id}`)?.focus();
  }

  return (
    <div className="flex flex-col gap-4">
      <div
        ref={list}
        role="tablist"
        aria-label={label}
        onKeyDown={onKeyDown}
        className="flex flex-wrap gap-1 border-b-2 border-rule"
      >
        {tabs.map((tab) => {
          const active = tab.id === current?.id;
          return (
            <button
              key={tab.id}
              id={`${base}-tab-${tab.id}`}
              type="button"
              role="tab"
              aria-selected={active}
              aria-controls={`${base}-panel-${tab.id}`}
              tabIndex={active ? 0 : -1}
              onClick={() => onSelect(tab.id)}
              className={`-mb-0.5 rounded-t-md border-b-2 px-3 py-2 text-sm font-semibold focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent ${
                active
                  ? 'border-accent text-accent-strong'
                  : 'border-transparent text-ink-600 hover:text-ink-900'
              }`}
            >
              {tab.label}
            </button>
          );
        })}
      </div>
      {current ? (
        <div
          id={`${base}-panel-${current.id}`}
          role="tabpanel"
          aria-labelledby={`${base}-tab-${current.id}`}
          tabIndex={0}
          className="focus-visible:outline-2 focus-visible:outline-offset-4 focus-visible:outline-accent"
        >
          {current.content()}
        </div>
      ) : null}
    </div>
  );
}

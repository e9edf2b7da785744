import { type ReactNode, useId, useState } from 'react';

export interface SidePanelTab {
  id: string;
  label: string;
  content: ReactNode;
}

/** Tabs for the workspace's side panel (WAI-ARIA tabs pattern: arrows move between tabs). */
export function SidePanelTabs({ tabs }: { tabs: SidePanelTab[] }) {
  const [current, setCurrent] = useState(tabs[0]?.id);
  const baseId = useId();
  const index = Math.max(
    0,
    tabs.findIndex((tab) => tab.id === current),
  );
  return (
    <div>
      <div role="tablist" aria-label="Side panel" className="flex flex-wrap border-b border-canvas-line">
        {tabs.map((tab, i) => (
          <button
            key={tab.id}
            id={`${baseId}-tab-${tab.id}`}
            type="button"
            role="tab"
            aria-selected={i === index}
            aria-controls={`${baseId}-panel-${tab.id}`}
            tabIndex={i === index ? 0 : -1}
            onClick={() => setCurrent(tab.id)}
            onKeyDown={(event) => {
              if (event.key !== 'ArrowRight' && event.key !== 'ArrowLeft') return;
              const next = (i + (event.key === 'ArrowRight' ? 1 : tabs.length - 1)) % tabs.length;
              setCurrent(tabs[next].id);
              document.getElementById(`${baseId}-tab-${tabs[next].id}`)?.focus();
            }}
            className={`-mb-px border-b-2 px-2.5 py-1.5 text-sm font-bold ${i === index ? 'border-accent text-ink' : 'border-transparent text-ink-muted hover:text-ink'}`}
          >
            {tab.label}
          </button>
        ))}
      </div>
      {tabs[index] && (
        <div
          role="tabpanel"
          id={`${baseId}-panel-${tabs[index].id}`}
          aria-labelledby={`${baseId}-tab-${tabs[index].id}`}
          className="max-h-[70vh] overflow-y-auto pt-3"
        >
          {tabs[index].content}
        </div>
      )}
    </div>
  );
}

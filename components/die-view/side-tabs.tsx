"use client";

import { useState } from "react";

/** A small tab strip for the side panel (WAI-ARIA tabs pattern). */
export function SideTabs({ tabs, initial }: { tabs: { id: string; label: string; content: React.ReactNode }[]; initial?: string }) {
  const [active, setActive] = useState(initial && tabs.some((t) => t.id === initial) ? initial : tabs[0].id);
  return (
    <div className="flex min-h-0 flex-1 flex-col">
      <div role="tablist" aria-label="Die panel" className="flex flex-wrap gap-x-1 border-b border-ink-800 px-3">
        {tabs.map((t) => (
          <button
            key={t.id}
            role="tab"
            id={`tab-${t.id}`}
            aria-selected={active === t.id}
            aria-controls={`panel-${t.id}`}
            onClick={() => setActive(t.id)}
            className={`-mb-px whitespace-nowrap border-b-2 px-2 py-2 text-xs font-medium ${active === t.id ? "border-kerf-500 text-ink-100" : "border-transparent text-ink-400 hover:text-ink-200"}`}
          >
            {t.label}
          </button>
        ))}
      </div>
      {tabs.map((t) => (
        <div
          key={t.id}
          role="tabpanel"
          id={`panel-${t.id}`}
          aria-labelledby={`tab-${t.id}`}
          hidden={active !== t.id}
          className="min-h-0 flex-1 overflow-y-auto p-4"
        >
          {active === t.id && t.content}
        </div>
      ))}
    </div>
  );
}

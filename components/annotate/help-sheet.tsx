"use client";

import { Dialog } from "@/components/ui/dialog";
import { SHORTCUTS } from "./editor/shortcuts";

const Key = ({ k }: { k: string }) => (
  <kbd className="whitespace-nowrap rounded border border-ink-700 bg-ink-800 px-1.5 py-0.5 font-mono text-xs text-ink-100">{k}</kbd>
);

/**
 * The keyboard help sheet ("?"): a wide dialog with the keys in a column of their own (wrapping
 * between keys, never inside one) and each description on a readable line beside them.
 */
export function HelpSheet({ open, onClose }: { open: boolean; onClose: () => void }) {
  return (
    <Dialog open={open} onClose={onClose} title="Keyboard and mouse" wide>
      <dl className="grid grid-cols-[minmax(9rem,13rem)_1fr] gap-x-6 text-sm leading-relaxed" data-testid="help-sheet">
        {SHORTCUTS.map((s) => (
          <div key={s.description} className="col-span-2 grid grid-cols-subgrid border-t border-ink-800 py-2">
            <dt className="flex flex-wrap content-start gap-1">
              {s.keys.map((k) => (
                <Key key={k} k={k} />
              ))}
            </dt>
            <dd className="max-w-prose text-ink-200">{s.description}</dd>
          </div>
        ))}
        <div className="col-span-2 grid grid-cols-subgrid border-t border-ink-800 py-2">
          <dt className="flex flex-wrap items-center gap-1">
            <Key k="Space" /> <span className="text-xs text-ink-300">+ drag</span>
          </dt>
          <dd className="max-w-prose text-ink-200">Pan the view while any tool is active; the wheel zooms</dd>
        </div>
      </dl>
    </Dialog>
  );
}

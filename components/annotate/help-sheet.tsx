"use client";

import { Dialog } from "@/components/ui/dialog";
import { SHORTCUTS } from "./editor/shortcuts";

/** The keyboard help sheet ("?"). */
export function HelpSheet({ open, onClose }: { open: boolean; onClose: () => void }) {
  return (
    <Dialog open={open} onClose={onClose} title="Keyboard and mouse">
      <table className="w-full text-sm">
        <tbody>
          {SHORTCUTS.map((s) => (
            <tr key={s.description} className="border-t border-ink-800">
              <td className="whitespace-nowrap py-1.5 pr-4 align-top">
                {s.keys.map((k) => (
                  <kbd key={k} className="mr-1 rounded border border-ink-700 bg-ink-800 px-1.5 py-0.5 text-xs">
                    {k}
                  </kbd>
                ))}
              </td>
              <td className="py-1.5 text-ink-200">{s.description}</td>
            </tr>
          ))}
          <tr className="border-t border-ink-800">
            <td className="py-1.5 pr-4">
              <kbd className="rounded border border-ink-700 bg-ink-800 px-1.5 py-0.5 text-xs">Space</kbd> + drag
            </td>
            <td className="py-1.5 text-ink-200">Pan the view while any tool is active; the wheel zooms</td>
          </tr>
        </tbody>
      </table>
    </Dialog>
  );
}

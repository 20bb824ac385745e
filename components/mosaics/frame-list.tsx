"use client";

import { useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { moveItem, naturalOrder } from "./frame-order";

export type PickedFrame = { key: string; file: File };

/**
 * The frames in capture order: dropped or chosen files, naturally sorted by name, each movable
 * up or down by its buttons or by Alt+↑ / Alt+↓ on the row; the number is the frame's place in
 * the capture path. While sending, each row shows its own progress.
 */
export function FrameList({
  frames,
  onChange,
  progress,
  disabled,
}: {
  frames: PickedFrame[];
  onChange: (frames: PickedFrame[]) => void;
  progress: number[] | null;
  disabled: boolean;
}) {
  const [dragging, setDragging] = useState(false);
  const input = useRef<HTMLInputElement>(null);
  const rows = useRef<(HTMLLIElement | null)[]>([]);
  const add = (files: FileList | null) => {
    if (!files?.length) return;
    const picked = [...files].map((file) => ({ key: `${file.name}:${file.size}:${file.lastModified}:${Math.random()}`, file }));
    const byName = naturalOrder([...frames, ...picked].map((f) => ({ name: f.file.name, f })));
    onChange(byName.map((x) => x.f));
  };
  const move = (i: number, by: -1 | 1) => {
    onChange(moveItem(frames, i, by));
    requestAnimationFrame(() => rows.current[i + by]?.focus());
  };
  return (
    <div className="flex flex-col gap-2">
      <div
        onDragOver={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={(e) => {
          e.preventDefault();
          setDragging(false);
          if (!disabled) add(e.dataTransfer.files);
        }}
        className={`flex flex-col items-center gap-2 rounded-md border border-dashed p-3 text-center text-sm ${dragging ? "border-kerf-400 bg-ink-800" : "border-ink-700"}`}
      >
        <span className="text-ink-300">Drop the frames here, or</span>
        <Button disabled={disabled} onClick={() => input.current?.click()}>
          Choose frames…
        </Button>
        <input
          ref={input}
          id="mosaic-files"
          type="file"
          multiple
          aria-label="Mosaic frames"
          accept="image/jpeg,image/png,image/tiff,image/webp,.tif,.tiff"
          className="sr-only"
          onChange={(e) => {
            add(e.target.files);
            e.target.value = "";
          }}
        />
      </div>
      {frames.length > 0 && (
        <>
          <p id="frame-order-help" className="text-xs text-ink-400">
            Sorted by file name. Move a frame with its buttons, or focus a row and press Alt+↑ / Alt+↓.
          </p>
          <ol
            aria-label="Frames in capture order"
            aria-describedby="frame-order-help"
            className="flex max-h-56 flex-col overflow-y-auto rounded-md border border-ink-800"
          >
            {frames.map((f, i) => (
              <li
                key={f.key}
                ref={(el) => {
                  rows.current[i] = el;
                }}
                tabIndex={0}
                aria-label={`Frame ${i + 1}: ${f.file.name}`}
                onKeyDown={(e) => {
                  if (disabled || !e.altKey) return;
                  const by = e.key === "ArrowUp" ? -1 : e.key === "ArrowDown" ? 1 : 0;
                  if (!by) return;
                  e.preventDefault();
                  move(i, by);
                }}
                className="flex items-center gap-2 border-b border-ink-800 px-2 py-1 text-xs last:border-b-0 focus:bg-ink-800 focus:outline-none"
              >
                <span className="w-8 text-right tabular-nums text-ink-400">{i + 1}</span>
                <span className="min-w-0 flex-1 truncate text-ink-100" title={f.file.name}>
                  {f.file.name}
                </span>
                {progress ? (
                  <progress aria-label={`Upload of frame ${i + 1}`} max={1} value={progress[i] ?? 0} className="h-1.5 w-20 accent-kerf-500" />
                ) : (
                  <span className="flex gap-1">
                    <Button className="px-1.5 py-0.5 text-xs" aria-label={`Move ${f.file.name} up`} disabled={disabled || i === 0} onClick={() => move(i, -1)}>
                      ↑
                    </Button>
                    <Button
                      className="px-1.5 py-0.5 text-xs"
                      aria-label={`Move ${f.file.name} down`}
                      disabled={disabled || i === frames.length - 1}
                      onClick={() => move(i, 1)}
                    >
                      ↓
                    </Button>
                    <Button
                      className="px-1.5 py-0.5 text-xs"
                      aria-label={`Remove ${f.file.name}`}
                      disabled={disabled}
                      onClick={() => onChange(frames.filter((x) => x.key !== f.key))}
                    >
                      ✕
                    </Button>
                  </span>
                )}
              </li>
            ))}
          </ol>
        </>
      )}
    </div>
  );
}

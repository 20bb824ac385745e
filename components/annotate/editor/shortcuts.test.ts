import { describe, expect, it } from "vitest";
import { handleKey, SHORTCUTS, TOOL_KEYS } from "./shortcuts";
import { TOOL_IDS, type KeyInput } from "./types";

const key = (k: string, mods: Partial<KeyInput> = {}): KeyInput => ({ key: k, shift: false, ctrl: false, meta: false, alt: false, ...mods });
const idle = { drawing: false, hasSelection: true };
const drawing = { drawing: true, hasSelection: true };

describe("handleKey", () => {
  it("gives every tool one letter, in either case", () => {
    expect(Object.values(TOOL_KEYS).sort()).toEqual([...TOOL_IDS].sort());
    for (const [letter, tool] of Object.entries(TOOL_KEYS)) {
      expect(handleKey(key(letter), idle)).toEqual({ type: "tool", tool });
      expect(handleKey(key(letter.toUpperCase(), { shift: true }), idle)).toEqual({ type: "tool", tool });
    }
  });

  it("lists every tool letter on the help sheet", () => {
    const listed = SHORTCUTS.flatMap((s) => s.keys);
    for (const letter of Object.keys(TOOL_KEYS)) expect(listed).toContain(letter.toUpperCase());
  });

  it("maps undo, redo and duplicate with Ctrl or Cmd", () => {
    for (const mod of [{ ctrl: true }, { meta: true }]) {
      expect(handleKey(key("z", mod), idle)).toEqual({ type: "undo" });
      expect(handleKey(key("Z", { ...mod, shift: true }), idle)).toEqual({ type: "redo" });
      expect(handleKey(key("y", mod), idle)).toEqual({ type: "redo" });
      expect(handleKey(key("d", mod), idle)).toEqual({ type: "duplicate" });
      expect(handleKey(key("p", mod), idle)).toBeNull();
    }
  });

  it("nudges with arrows, ArrowUp being +y in the die frame", () => {
    expect(handleKey(key("ArrowUp"), idle)).toEqual({ type: "nudge", dx: 0, dy: 1 });
    expect(handleKey(key("ArrowDown", { shift: true }), idle)).toEqual({ type: "nudge", dx: 0, dy: -10 });
    expect(handleKey(key("ArrowLeft"), idle)).toEqual({ type: "nudge", dx: -1, dy: 0 });
    expect(handleKey(key("ArrowRight", { shift: true }), idle)).toEqual({ type: "nudge", dx: 10, dy: 0 });
    expect(handleKey(key("ArrowUp"), { drawing: false, hasSelection: false })).toBeNull();
  });

  it("deletes with Delete or Backspace, but Backspace removes a vertex while drawing", () => {
    expect(handleKey(key("Delete"), idle)).toEqual({ type: "delete" });
    expect(handleKey(key("Backspace"), idle)).toEqual({ type: "delete" });
    expect(handleKey(key("Backspace"), drawing)).toEqual({ type: "remove-last-point" });
    expect(handleKey(key("Delete"), drawing)).toBeNull();
    expect(handleKey(key("Delete"), { drawing: false, hasSelection: false })).toBeNull();
  });

  it("maps Escape, Enter while drawing, and ? for help", () => {
    expect(handleKey(key("Escape"), idle)).toEqual({ type: "cancel" });
    expect(handleKey(key("Enter"), drawing)).toEqual({ type: "finish" });
    expect(handleKey(key("Enter"), idle)).toBeNull();
    expect(handleKey(key("?", { shift: true }), idle)).toEqual({ type: "help" });
  });

  it("leaves other keys alone, including names that exist on every object", () => {
    for (const k of ["constructor", "toString", "F5", "Tab", " ", "+", "0", "q"]) expect(handleKey(key(k), idle)).toBeNull();
    expect(handleKey(key("p", { alt: true }), idle)).toBeNull();
  });
});

"use client";

import { useEffect, useMemo, useRef, useState } from "react";
import { Layer, Shape, Stage } from "react-konva";
import type Konva from "konva";
import { applyAffine } from "@/lib/geometry/affine";
import { boundingBox } from "@/lib/geometry/measure";
import { viewBoxUm } from "@/lib/geometry/view-box";
import type { Affine2x3 } from "@/lib/geometry/types";
import type { AnyShape, MarkupKind } from "@/lib/markup/types";
import type { ViewerApi } from "@/components/viewer";
import type { Editor, EditorState, PointerInput } from "./editor/types";
import { dieToScreenMatrix, screenPxPerUm } from "./render/die-to-screen";
import { drawMarkup } from "./render/draw-markup";
import { drawInteraction } from "./render/draw-interaction";

/** How near, in screen px, a click must be to a line, vertex or handle to hit it. */
const HIT_TOLERANCE_PX = 6;

/** Extra drawing over the markup (e.g. symmetry ghosts, thread pins), in screen px through `matrix`. */
export type OverlayDrawer = (ctx: CanvasRenderingContext2D, matrix: Affine2x3) => void;

type Props = {
  api: ViewerApi;
  editor: Editor;
  state: EditorState;
  imageToDie: Affine2x3;
  hiddenKinds: ReadonlySet<MarkupKind>;
  labels: boolean;
  /** Drawn between the markup and the interaction layer; a new function redraws. */
  extraDrawers?: readonly OverlayDrawer[];
  /** Shapes to leave out besides hidden kinds (e.g. by review state). */
  isHidden?: (s: AnyShape) => boolean;
};

function useHostSize(api: ViewerApi) {
  const el = api.viewer.element as HTMLElement;
  const [size, setSize] = useState({ width: el.clientWidth, height: el.clientHeight });
  useEffect(() => {
    const ro = new ResizeObserver(() => setSize({ width: el.clientWidth, height: el.clientHeight }));
    ro.observe(el);
    return () => ro.disconnect();
  }, [el]);
  return size;
}

/**
 * The markup layer over the viewer: a Konva stage whose two custom shapes draw the model and
 * the interaction through the one die → screen transform, re-read from the viewer's current
 * (animating) view on every view change, so markup stays locked to the image. Pointer input is
 * converted to die µm here and handed to the editor, which owns hit testing.
 */
export function MarkupOverlay({ api, editor, state, imageToDie, hiddenKinds, labels, extraDrawers = [], isHidden }: Props) {
  const size = useHostSize(api);
  const layer = useRef<Konva.Layer>(null);
  const host = useRef<HTMLDivElement>(null);
  const matrix = useRef<Affine2x3>(dieToScreenMatrix(imageToDie, api.imageToScreen));
  const [spaceHeld, setSpaceHeld] = useState(false);

  // The micrograph's own scale (µm per image px) decides how many decimals a ruler's length gets.
  const umPerPx = Math.sqrt(Math.abs(imageToDie[0][0] * imageToDie[1][1] - imageToDie[0][1] * imageToDie[1][0]));
  const visibleShapes = useMemo(() => state.shapeList.filter((s) => !hiddenKinds.has(s.kind) && !isHidden?.(s)), [state.shapeList, hiddenKinds, isHidden]);
  const bboxes = useMemo(() => {
    const m = new Map<string, [number, number, number, number]>();
    for (const s of state.shapeList) {
      const b = boundingBox(s.geometry);
      m.set(s.id, [b.minX, b.minY, b.maxX, b.maxY]);
    }
    return m;
  }, [state.shapeList]);

  useEffect(() => {
    const update = () => {
      matrix.current = dieToScreenMatrix(imageToDie, api.imageToScreen);
      // The current die → screen map, for tests and tools that need it from outside.
      host.current?.setAttribute("data-die-to-screen", JSON.stringify(matrix.current));
      layer.current?.batchDraw();
    };
    update();
    return api.onViewChange(update);
  }, [api, imageToDie]);

  useEffect(() => {
    layer.current?.batchDraw();
  }, [state, visibleShapes, labels, size, extraDrawers]);

  useEffect(() => {
    const down = (e: KeyboardEvent) =>
      e.code === "Space" && !(e.target instanceof HTMLInputElement || e.target instanceof HTMLTextAreaElement) && setSpaceHeld(true);
    const up = (e: KeyboardEvent) => e.code === "Space" && setSpaceHeld(false);
    window.addEventListener("keydown", down);
    window.addEventListener("keyup", up);
    return () => {
      window.removeEventListener("keydown", down);
      window.removeEventListener("keyup", up);
    };
  }, []);

  const ready = () => screenPxPerUm(matrix.current) > 1e-12;
  const visibleUm = (): [number, number, number, number] => {
    const b = viewBoxUm(size, api.screenToImage, imageToDie);
    return [b.minX, b.minY, b.maxX, b.maxY];
  };

  const toInput = (e: React.PointerEvent | React.MouseEvent): PointerInput => {
    const rect = (e.currentTarget as HTMLElement).getBoundingClientRect();
    const img = api.screenToImage(e.clientX - rect.left, e.clientY - rect.top);
    const [x, y] = applyAffine(imageToDie, img.x, img.y);
    return { x, y, toleranceUm: HIT_TOLERANCE_PX / screenPxPerUm(matrix.current), shift: e.shiftKey, alt: e.altKey };
  };

  const capturing = state.activeTool !== "pan" && !spaceHeld;
  return (
    <div
      ref={host}
      data-testid="markup-overlay"
      data-tool={state.activeTool}
      data-tool-state={state.toolState}
      className={`absolute inset-0 ${capturing ? "pointer-events-auto" : "pointer-events-none"} ${state.activeTool === "select" ? "cursor-default" : "cursor-crosshair"}`}
      onPointerDown={(e) => {
        if (e.button !== 0 || !ready()) return;
        (e.currentTarget as HTMLElement).setPointerCapture(e.pointerId);
        editor.pointerDown(toInput(e));
      }}
      onPointerMove={(e) => ready() && editor.pointerMove(toInput(e))}
      onPointerUp={(e) => e.button === 0 && ready() && editor.pointerUp(toInput(e))}
      onDoubleClick={(e) => ready() && editor.doubleClick(toInput(e))}
      onWheel={(e) => {
        // The overlay takes the pointer, so it hands wheel zoom on to the viewer.
        const rect = (e.currentTarget as HTMLElement).getBoundingClientRect();
        api.zoomAt(e.deltaY < 0 ? 1.2 : 1 / 1.2, e.clientX - rect.left, e.clientY - rect.top);
      }}
    >
      <Stage width={size.width} height={size.height} listening={false}>
        <Layer ref={layer} listening={false}>
          <Shape
            perfectDrawEnabled={false}
            listening={false}
            sceneFunc={(ctx) =>
              ready() && drawMarkup(ctx._context, visibleShapes, { matrix: matrix.current, pixelRatio: 1, visibleUm: visibleUm(), labels, bboxes, umPerPx })
            }
          />
          <Shape perfectDrawEnabled={false} listening={false} sceneFunc={(ctx) => ready() && extraDrawers.forEach((d) => d(ctx._context, matrix.current))} />
          <Shape perfectDrawEnabled={false} listening={false} sceneFunc={(ctx) => ready() && drawInteraction(ctx._context, state, matrix.current)} />
        </Layer>
      </Stage>
    </div>
  );
}

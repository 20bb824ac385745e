import type OpenSeadragon from "openseadragon";

/**
 * Keeps `data-view-idle` on the viewer's element: "true" once the view has stopped moving and
 * every image in it has all the tiles it needs for that view, "false" while it animates or
 * loads. The end-to-end tests wait on it instead of sleeping a guessed time.
 */
export function markViewIdle(viewer: OpenSeadragon.Viewer): void {
  const el = viewer.element as HTMLElement;
  let animating = false;
  const write = () => {
    const n = viewer.world.getItemCount();
    let loaded = n > 0;
    for (let i = 0; i < n; i++) loaded = loaded && viewer.world.getItemAt(i).getFullyLoaded();
    el.dataset.viewIdle = String(!animating && loaded);
  };
  viewer.addHandler("animation-start", () => {
    animating = true;
    write();
  });
  viewer.addHandler("animation-finish", () => {
    animating = false;
    write();
  });
  viewer.world.addHandler("add-item", (e) => {
    e.item.addHandler("fully-loaded-change", write);
    write();
  });
  viewer.world.addHandler("remove-item", write);
  write();
}

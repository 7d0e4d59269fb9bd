// Pan and zoom of the photo view: the stage is the photo at the container's width, scaled by
// `scale` about its top-left corner and shifted by (tx, ty) screen pixels. At scale 1 the photo
// exactly fills the container, so panning is clamped to keep it covered.

/** The view's transform. */
export interface ViewTransform {
  scale: number;
  tx: number;
  ty: number;
}

/** Closest zoom (our own: 1 photo pixel over several screen pixels on a 12 MP photo on a phone). */
export const MAX_ZOOM = 12;

export const IDENTITY: ViewTransform = { scale: 1, tx: 0, ty: 0 };

/** Zooms by `factor` about the container point (px, py), keeping that point still. */
export function zoomAbout(view: ViewTransform, factor: number, px: number, py: number, width: number, height: number): ViewTransform {
  const scale = Math.min(MAX_ZOOM, Math.max(1, view.scale * factor));
  const k = scale / view.scale;
  return clampPan({ scale, tx: px - (px - view.tx) * k, ty: py - (py - view.ty) * k }, width, height);
}

/** Shifts the view by (dx, dy) screen pixels. */
export function panBy(view: ViewTransform, dx: number, dy: number, width: number, height: number): ViewTransform {
  return clampPan({ ...view, tx: view.tx + dx, ty: view.ty + dy }, width, height);
}

/** Keeps the scaled photo covering the container. */
export function clampPan(view: ViewTransform, width: number, height: number): ViewTransform {
  const clamp = (v: number, min: number) => Math.min(0, Math.max(min, v));
  return { scale: view.scale, tx: clamp(view.tx, width - width * view.scale), ty: clamp(view.ty, height - height * view.scale) };
}

/** A container point → upright photo pixel coordinates. */
export function toPhoto(view: ViewTransform, px: number, py: number, containerWidth: number, photoWidth: number): [number, number] {
  const perScreen = photoWidth / containerWidth;
  return [((px - view.tx) / view.scale) * perScreen, ((py - view.ty) / view.scale) * perScreen];
}

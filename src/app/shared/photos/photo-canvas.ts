import { ChangeDetectionStrategy, Component, ElementRef, computed, input, output, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import type { Region } from '../../../../shared/photo/region.js';
import { dragRegion, pointRegion, polygonRegion, regionPath, type PhotoSize, type Tool } from './region-drawing';
import { IDENTITY, panBy, toPhoto, zoomAbout, type ViewTransform } from './view-transform';

type Point = { x: number; y: number };
type Gesture =
  | { kind: 'draw'; pointerId: number; start: [number, number] }
  | { kind: 'pan'; last: Point }
  | { kind: 'pinch'; view: ViewTransform; distance: number; mid: Point }
  | null;

/** Zoom step of the zoom buttons (our own). */
const ZOOM_STEP = 1.6;
/** A drag shorter than this many screen pixels is a tap, not a rectangle (our own). */
const MIN_DRAG_PX = 8;
/** A tap this close (screen pixels) to the first point of an outline closes it. */
const CLOSE_PX = 24;

/**
 * The upright photo filling the width, with pinch-zoom, pan and zoom buttons, and regions drawn
 * over it with pointer events (no gesture library is installed; this is a small one of our own).
 * One finger draws with the chosen tool; two fingers zoom and pan; the "move" tool pans with one.
 */
@Component({
  selector: 'hl-photo-canvas',
  imports: [MatButtonModule, MatIconModule],
  templateUrl: './photo-canvas.html',
  styleUrl: './photo-canvas.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PhotoCanvas {
  private readonly viewport = viewChild.required<ElementRef<HTMLElement>>('viewport');

  /** The display copy's URL. */
  readonly src = input.required<string>();
  /** The upright photo's size; regions are in its pixels. */
  readonly size = input.required<PhotoSize>();
  readonly tool = input.required<Tool>();
  /** Radius of a tap, in photo pixels. */
  readonly pointRadius = input.required<number>();
  /** Whether a new stroke marks the grey card rather than the tissue (only changes the outline drawn). */
  readonly markingCard = input(false);
  readonly tissue = input<Region | null>(null);
  readonly card = input<Region | null>(null);

  /** A finished region. */
  readonly regionDrawn = output<Region>();
  /** The region being drawn, for the live preview; null when none. */
  readonly draftChange = output<Region | null>();
  /** How many points the outline being tapped has. */
  readonly outlinePointsChange = output<number>();
  /** The display copy has loaded (for the preview canvas). */
  readonly imageLoad = output<HTMLImageElement>();

  protected readonly view = signal<ViewTransform>(IDENTITY);
  protected readonly draft = signal<Region | null>(null);
  protected readonly outline = signal<[number, number][]>([]);
  protected readonly transform = computed(() => {
    const v = this.view();
    return `translate(${v.tx}px, ${v.ty}px) scale(${v.scale})`;
  });
  protected readonly zoomed = computed(() => this.view().scale > 1.001);
  protected readonly viewBox = computed(() => `0 0 ${this.size().width} ${this.size().height}`);
  protected readonly pathOf = regionPath;

  private readonly pointers = new Map<number, Point>();
  private gesture: Gesture = null;

  /** Closes the outline being tapped, if it has three points. */
  finishOutline(): void {
    const region = polygonRegion(this.outline());
    if (region) this.regionDrawn.emit(region);
    this.resetOutline();
  }

  /** Takes back the last point of the outline. */
  undoOutlinePoint(): void {
    this.setOutline(this.outline().slice(0, -1));
  }

  /** Back to the whole photo. */
  resetZoom(): void {
    this.view.set(IDENTITY);
  }

  protected zoomBy(factor: number): void {
    const { width, height } = this.box();
    this.view.update((v) => zoomAbout(v, factor, width / 2, height / 2, width, height));
  }

  protected readonly zoomStep = ZOOM_STEP;

  protected pointerDown(event: PointerEvent): void {
    if (event.pointerType === 'mouse' && event.button !== 0) return;
    this.viewport().nativeElement.setPointerCapture?.(event.pointerId);
    event.preventDefault();
    this.pointers.set(event.pointerId, this.local(event));
    if (this.pointers.size === 2) return this.startPinch();
    if (this.pointers.size > 2) return;
    if (this.tool() === 'move') this.gesture = { kind: 'pan', last: this.local(event) };
    else this.startDraw(event);
  }

  protected pointerMove(event: PointerEvent): void {
    if (!this.pointers.has(event.pointerId)) return;
    this.pointers.set(event.pointerId, this.local(event));
    const g = this.gesture;
    if (g?.kind === 'pinch') this.movePinch(g);
    else if (g?.kind === 'pan') this.movePan(g, this.local(event));
    else if (g?.kind === 'draw' && g.pointerId === event.pointerId) this.moveDraw(g, event);
  }

  protected pointerUp(event: PointerEvent): void {
    const g = this.gesture;
    this.pointers.delete(event.pointerId);
    if (g?.kind === 'draw' && g.pointerId === event.pointerId) this.finishDraw();
    if (this.pointers.size === 0 || g?.kind === 'pinch') this.gesture = null;
  }

  protected pointerCancel(event: PointerEvent): void {
    this.pointers.delete(event.pointerId);
    this.gesture = null;
    this.setDraft(null);
  }

  protected wheel(event: WheelEvent): void {
    event.preventDefault();
    const p = this.local(event);
    const { width, height } = this.box();
    this.view.update((v) => zoomAbout(v, Math.exp(-event.deltaY * 0.0015), p.x, p.y, width, height));
  }

  private startDraw(event: PointerEvent): void {
    const at = this.photoPoint(this.local(event));
    const tool = this.tool();
    if (tool === 'polygon') return this.addOutlinePoint(at);
    this.gesture = { kind: 'draw', pointerId: event.pointerId, start: at };
    if (tool === 'point') this.setDraft(pointRegion(at, this.pointRadius(), this.size()));
  }

  private moveDraw(g: { start: [number, number] }, event: PointerEvent): void {
    const at = this.photoPoint(this.local(event));
    const tool = this.tool();
    if (tool === 'point') this.setDraft(pointRegion(at, this.pointRadius(), this.size()));
    else if (tool === 'rect' || tool === 'ellipse') this.setDraft(dragRegion(tool, g.start, at, this.size(), this.screenToPhoto(MIN_DRAG_PX)));
  }

  private finishDraw(): void {
    const region = this.draft();
    this.gesture = null;
    this.setDraft(null);
    if (region) this.regionDrawn.emit(region);
  }

  private addOutlinePoint(at: [number, number]): void {
    const points = this.outline();
    const first = points[0];
    if (first && points.length >= 3 && Math.hypot(at[0] - first[0], at[1] - first[1]) < this.screenToPhoto(CLOSE_PX)) return this.finishOutline();
    this.setOutline([...points, at]);
  }

  private startPinch(): void {
    this.setDraft(null);
    const [a, b] = [...this.pointers.values()] as [Point, Point];
    this.gesture = { kind: 'pinch', view: this.view(), distance: Math.max(1, Math.hypot(a.x - b.x, a.y - b.y)), mid: { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 } };
  }

  private movePinch(g: { view: ViewTransform; distance: number; mid: Point }): void {
    const [a, b] = [...this.pointers.values()] as [Point, Point];
    if (!a || !b) return;
    const { width, height } = this.box();
    const mid = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
    const zoomed = zoomAbout(g.view, Math.hypot(a.x - b.x, a.y - b.y) / g.distance, g.mid.x, g.mid.y, width, height);
    this.view.set(panBy(zoomed, mid.x - g.mid.x, mid.y - g.mid.y, width, height));
  }

  private movePan(g: { last: Point }, at: Point): void {
    const { width, height } = this.box();
    this.view.update((v) => panBy(v, at.x - g.last.x, at.y - g.last.y, width, height));
    g.last = at;
  }

  private setDraft(region: Region | null): void {
    this.draft.set(region);
    this.draftChange.emit(region);
  }

  private setOutline(points: [number, number][]): void {
    this.outline.set(points);
    this.outlinePointsChange.emit(points.length);
    const region = polygonRegion(points);
    this.draft.set(region);
    this.draftChange.emit(region);
  }

  private resetOutline(): void {
    this.outline.set([]);
    this.outlinePointsChange.emit(0);
    this.setDraft(null);
  }

  private local(event: { clientX: number; clientY: number }): Point {
    const rect = this.viewport().nativeElement.getBoundingClientRect();
    return { x: event.clientX - rect.left, y: event.clientY - rect.top };
  }

  private box(): { width: number; height: number } {
    const rect = this.viewport().nativeElement.getBoundingClientRect();
    return { width: rect.width || 1, height: rect.height || 1 };
  }

  private photoPoint(p: Point): [number, number] {
    return toPhoto(this.view(), p.x, p.y, this.box().width, this.size().width);
  }

  private screenToPhoto(px: number): number {
    return (px * this.size().width) / this.box().width / this.view().scale;
  }
}

import { ChangeDetectionStrategy, Component, DestroyRef, type OnInit, computed, inject, input, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSliderModule } from '@angular/material/slider';
import { Router } from '@angular/router';
import type { Subscription } from 'rxjs';

import type { PhotoDto, PhotoSample } from '../../../../../shared/api/photo-answers.js';
import type { Region } from '../../../../../shared/photo/region.js';
import { ApiError } from '../../../core/http/api-error';
import { OfflineQueue } from '../../../core/offline/offline-queue';
import { PhotoCanvas } from '../../../shared/photos/photo-canvas';
import { ClusterReadings } from '../components/cluster-readings';
import { RecordCautions } from '../components/record-cautions';
import { SampleResult } from '../components/sample-result';
import { previewRegion, type Pixels } from '../data/photo-preview';
import { PhotosApi } from '../../../shared/photos/photos-api';
import { photoSourceFromParams, photoSourceParams } from '../data/photo-source';
import type { PhotoSource } from '../data/reading-draft';
import { defaultRadius, describeRegion, type Tool } from '../../../shared/photos/region-drawing';
import { ProblemNotice } from '../../../shared/problem-notice';

/** What the next stroke marks. */
type Marking = 'tissue' | 'card';

/** The drawing tools as offered, with words under each icon. */
const TOOLS: readonly { tool: Tool; icon: string; label: string; hint: string }[] = [
  { tool: 'rect', icon: 'crop_square', label: 'Box', hint: 'Drag a box over the tissue.' },
  { tool: 'ellipse', icon: 'circle', label: 'Oval', hint: 'Drag an oval over the tissue.' },
  { tool: 'polygon', icon: 'polyline', label: 'Outline', hint: 'Tap points around the tissue, then Finish outline.' },
  { tool: 'point', icon: 'adjust', label: 'Spot', hint: 'Tap the tissue; set the spot size below.' },
  { tool: 'move', icon: 'pan_tool', label: 'Move', hint: 'Drag to move around the zoomed photo.' },
];

/**
 * Record → Photo: take or choose a photo, see it upright, draw the region on the tissue (and
 * optionally on a grey card), see a live preview at once and then the server's reading. A region
 * that splits into colours can be saved as one reading per colour, each of its own character.
 */
@Component({
  selector: 'hl-photo-page',
  imports: [
    ProblemNotice,
    MatButtonModule,
    MatButtonToggleModule,
    MatIconModule,
    MatProgressBarModule,
    MatProgressSpinnerModule,
    MatSliderModule,
    ClusterReadings,
    PhotoCanvas,
    RecordCautions,
    SampleResult,
  ],
  templateUrl: './photo-page.html',
  styleUrl: './photo-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PhotoPage implements OnInit {
  private readonly api = inject(PhotosApi);
  private readonly router = inject(Router);
  private readonly canvas = viewChild(PhotoCanvas);
  private readonly queue = inject(OfflineQueue);

  // The address's query parameters (component input binding): a photo to open again with the
  // region and card the reading form sent back, and the reading being corrected, if any.
  readonly photoParam = input<string>(undefined, { alias: 'photo' });
  readonly localPhoto = input<string>();
  readonly region = input<string>();
  readonly cardParam = input<string>(undefined, { alias: 'card' });
  readonly correct = input<string>();

  protected readonly tools = TOOLS;
  protected readonly photo = signal<PhotoDto | null>(null);
  protected readonly upload = signal<{ name: string; fraction: number | null } | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly tool = signal<Tool>('rect');
  protected readonly marking = signal<Marking>('tissue');
  protected readonly tissue = signal<Region | null>(null);
  protected readonly card = signal<Region | null>(null);
  protected readonly draft = signal<Region | null>(null);
  protected readonly outlinePoints = signal(0);
  protected readonly radius = signal(10);
  protected readonly sample = signal<PhotoSample | null>(null);
  protected readonly sampling = signal(false);
  /** Set when the photo is kept on the phone (no connection): only the phone's preview measures it, marked provisional. */
  protected readonly localPhotoId = signal<string | null>(null);
  private localUrl: string | null = null;

  private readonly pixels = signal<Pixels | null>(null);
  private uploadRun: Subscription | null = null;
  private sampleRun: Subscription | null = null;

  protected readonly size = computed(() => {
    const p = this.photo();
    return p ? { width: p.width, height: p.height } : { width: 1, height: 1 };
  });
  protected readonly hint = computed(() => {
    if (this.marking() === 'card') return 'Draw on the grey or white card in the same photo.';
    const hint = TOOLS.find((t) => t.tool === this.tool())!.hint;
    return this.tissue() && this.tool() !== 'move' ? `${hint} Drawing again replaces the region.` : hint;
  });
  protected readonly radiusRange = computed(() => {
    const min = Math.min(this.size().width, this.size().height);
    return { min: 2, max: Math.max(4, Math.round(min / 8)) };
  });
  /** The approximate reading of what is drawn now, computed in the browser from the display copy. */
  protected readonly preview = computed(() => {
    const pixels = this.pixels();
    const photo = this.photo();
    const drawing = this.draft();
    const tissue = this.marking() === 'tissue' ? (drawing ?? this.tissue()) : this.tissue();
    const card = this.marking() === 'card' ? (drawing ?? this.card()) : this.card();
    if (!pixels || !photo || !tissue) return null;
    return previewRegion(pixels, photo.width, tissue, card);
  });
  protected readonly showPreview = computed(() => this.preview() !== null && (this.draft() !== null || this.sampling() || this.sample() === null));
  protected readonly describe = describeRegion;

  constructor() {
    inject(DestroyRef).onDestroy(() => {
      this.uploadRun?.unsubscribe();
      this.sampleRun?.unsubscribe();
      if (this.localUrl) URL.revokeObjectURL(this.localUrl);
    });
  }

  ngOnInit(): void {
    this.reopenFromAddress();
  }

  /** Into the reading form with this photo, region and card (carried in the form's address). */
  protected saveAsReading(): void {
    const photo = this.photo();
    const region = this.tissue();
    if (!photo || !region) return;
    const correct = this.correct() ?? null;
    const local = this.localPhotoId();
    if (local) {
      const pv = this.preview();
      void this.queue.notePhoto(local, { region, neutral: this.card(), preview: pv ? { lab: pv.lab, hex: pv.hex } : null }).then(() =>
        this.router.navigate(['/record'], { queryParams: { ...photoSourceParams({ photoId: 0, localPhotoId: local, region, neutral: this.card() }), correct } }),
      );
      return;
    }
    void this.router.navigate(['/record'], { queryParams: { ...photoSourceParams({ photoId: photo.id, region, neutral: this.card() }), correct } });
  }

  protected photoChosen(event: Event): void {
    const inputElement = event.target as HTMLInputElement;
    const file = inputElement.files?.[0];
    inputElement.value = '';
    if (file) this.startUpload(file);
  }

  protected cancelUpload(): void {
    this.uploadRun?.unsubscribe();
    this.upload.set(null);
  }

  protected chooseTool(tool: Tool): void {
    this.tool.set(tool);
  }

  protected chooseMarking(marking: Marking): void {
    this.marking.set(marking);
    if (this.tool() === 'move') this.tool.set('rect');
  }

  protected regionDrawn(region: Region): void {
    if (this.marking() === 'card') {
      this.card.set(region);
      this.marking.set('tissue');
    } else {
      this.tissue.set(region);
    }
    this.measure();
  }

  protected removeCard(): void {
    this.card.set(null);
    this.measure();
  }

  protected finishOutline(): void {
    this.canvas()?.finishOutline();
  }

  protected undoOutlinePoint(): void {
    this.canvas()?.undoOutlinePoint();
  }

  /** Reads the display copy into pixels for the preview; without a 2D canvas (tests) there is no preview. */
  protected imageLoaded(image: HTMLImageElement): void {
    const canvas = document.createElement('canvas');
    canvas.width = image.naturalWidth;
    canvas.height = image.naturalHeight;
    const context = canvas.getContext('2d', { willReadFrequently: true });
    if (!context || !canvas.width) return;
    context.drawImage(image, 0, 0);
    this.pixels.set(context.getImageData(0, 0, canvas.width, canvas.height));
  }

  /** Asks the server for the reading of the tissue region (balanced on the card when one is marked). */
  protected measure(): void {
    const photo = this.photo();
    const region = this.tissue();
    if (!photo || !region) return;
    if (this.localPhotoId()) return; // no server to ask: the preview stands, marked provisional
    const card = this.card();
    this.sampleRun?.unsubscribe();
    this.sampling.set(true);
    this.problem.set(null);
    this.sampleRun = this.api.sample(photo.id, card ? { region, neutral: { region: card } } : { region }).subscribe({
      next: (sample) => {
        this.sample.set(sample);
        this.sampling.set(false);
      },
      error: (error: unknown) => {
        this.sample.set(null);
        this.sampling.set(false);
        this.problem.set(messageOf(error));
      },
    });
  }

  private startUpload(file: File): void {
    this.uploadRun?.unsubscribe();
    this.problem.set(null);
    if (navigator.onLine === false) {
      void this.keepOnPhone(file);
      return;
    }
    this.upload.set({ name: file.name, fraction: 0 });
    this.uploadRun = this.api.upload(file, file.name || 'photo.jpg').subscribe({
      next: (progress) => {
        if (progress.kind === 'progress') this.upload.set({ name: file.name, fraction: progress.fraction });
        else this.show(progress.photo);
      },
      error: (error: unknown) => {
        this.upload.set(null);
        if (error instanceof ApiError && (error.status === 0 || (error.status === 504 && error.type === 'about:blank'))) void this.keepOnPhone(file);
        else this.problem.set(messageOf(error));
      },
    });
  }

  /** Out of range: the photo waits in the offline queue and is shown from the phone. */
  private async keepOnPhone(file: Blob, name = (file as File).name || 'photo.jpg', existingId: string | null = null): Promise<void> {
    if (this.localUrl) URL.revokeObjectURL(this.localUrl);
    this.localUrl = URL.createObjectURL(file);
    // The browser applies the EXIF orientation, as the server does, so regions mean the same pixels.
    const image = new Image();
    image.src = this.localUrl;
    await image.decode();
    const size = { width: image.naturalWidth, height: image.naturalHeight };
    const id = existingId ?? (await this.queue.queuePhoto({ blob: file, name, ...size }));
    this.localPhotoId.set(id);
    this.show({ id: 0, ...size, sha256: '', sourceProfile: 'none', mime: file.type, capturedAt: null, orientation: 1, byteSize: file.size, uploadedById: 0, createdAt: new Date().toISOString(), imageUrl: this.localUrl, thumbUrl: this.localUrl });
  }

  /** Opens the photo the address names again (back from the reading form), with the region and card it sent back. */
  private reopenFromAddress(): void {
    const source = photoSourceFromParams({ photo: this.photoParam(), localPhoto: this.localPhoto(), region: this.region(), card: this.cardParam() });
    const id = Number(this.photoParam());
    if (Number.isSafeInteger(id) && id > 0) this.reopen(id, source);
    const local = this.localPhoto();
    if (local) void this.reopenLocal(local, source);
  }

  /** Opens a photo kept on the phone again, with the region sent back from the reading form. */
  private async reopenLocal(id: string, source: PhotoSource | null): Promise<void> {
    const kept = await this.queue.photo(id);
    if (!kept) return this.problem.set('That photo is no longer on this phone; take or choose it again.');
    await this.keepOnPhone(kept.blob, kept.name, id);
    if (source?.localPhotoId === id) {
      this.tissue.set(source.region);
      this.card.set(source.neutral);
    }
  }

  /** Opens a stored photo again; a region sent back from the reading form is drawn and measured again. */
  private reopen(id: number, source: PhotoSource | null): void {
    this.api.get(id).subscribe({
      next: (photo) => {
        this.show(photo);
        if (source?.photoId !== photo.id) return;
        this.tissue.set(source.region);
        this.card.set(source.neutral);
        this.measure();
      },
      error: () => this.problem.set('That photo could not be opened; take or choose it again.'),
    });
  }

  private show(photo: PhotoDto): void {
    this.upload.set(null);
    this.photo.set(photo);
    this.pixels.set(null);
    this.tissue.set(null);
    this.card.set(null);
    this.sample.set(null);
    this.marking.set('tissue');
    this.radius.set(defaultRadius(photo));
    if (photo.id > 0) this.localPhotoId.set(null);
    const local = this.localPhotoId();
    // The reading being corrected, if any, stays in the address for the way back to the form.
    void this.router.navigate([], { queryParams: { ...(local ? { localPhoto: local } : { photo: photo.id }), correct: this.correct() ?? null }, replaceUrl: true });
  }
}

function messageOf(error: unknown): string {
  if (error instanceof ApiError) return error.detail ? `${error.title}: ${error.detail}` : error.title;
  return 'Something went wrong. Try again.';
}

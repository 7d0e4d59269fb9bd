import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, inject, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { Router } from '@angular/router';

import { plantIdFromScan } from '../../../../../shared/collection/plant-link.js';
import { decodeQr, decodeQrFile } from '../data/label-decoder';

/** How often a camera frame is read (our own: quick enough to feel instant, light on a phone). */
const FRAME_MS = 250;

/**
 * "Scan a label": the phone's back camera, or a photo of the label, read for its QR code; a plant
 * label's code opens that plant's sheet. Anything else is said in words.
 */
@Component({
  selector: 'hl-label-scanner',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="scan">
      @if (scanning()) {
        <video #video class="video" playsinline muted aria-label="Camera view: hold the label's code inside the frame"></video>
        <button mat-stroked-button type="button" class="wide" (click)="stop()"><mat-icon>close</mat-icon> Stop the camera</button>
      } @else {
        <button mat-stroked-button type="button" class="wide" (click)="start()"><mat-icon>qr_code_scanner</mat-icon> Scan a label</button>
      }
      <label class="photo-pick">
        <mat-icon aria-hidden="true">image</mat-icon>
        <span>Or read a photo of the label</span>
        <input type="file" accept="image/*" class="file" aria-label="Photo of a plant label" (change)="readPhoto($event)" />
      </label>
      @if (message(); as m) {
        <p class="message" role="status">{{ m }}</p>
      }
    </div>
  `,
  styles: `
    .scan {
      display: flex;
      flex-direction: column;
      gap: 8px;
      margin: 0 0 16px;
    }
    .wide {
      min-height: 48px;
      width: 100%;
    }
    .video {
      width: 100%;
      max-height: 50vh;
      background: #000;
      border-radius: 8px;
    }
    .photo-pick {
      display: flex;
      align-items: center;
      gap: 8px;
      min-height: 48px;
      color: var(--mat-sys-primary);
      cursor: pointer;
    }
    .file {
      font-size: 14px;
      max-width: 100%;
    }
    .message {
      margin: 0;
      font: var(--mat-sys-body-medium);
    }
  `,
})
export class LabelScanner {
  private readonly router = inject(Router);
  private readonly video = viewChild<ElementRef<HTMLVideoElement>>('video');

  protected readonly scanning = signal(false);
  protected readonly message = signal<string | null>(null);
  private stream: MediaStream | null = null;
  private timer: ReturnType<typeof setTimeout> | null = null;

  constructor() {
    inject(DestroyRef).onDestroy(() => this.stop());
  }

  protected async start(): Promise<void> {
    this.message.set(null);
    if (!navigator.mediaDevices?.getUserMedia) {
      this.message.set('This browser cannot open the camera here: read a photo of the label instead.');
      return;
    }
    try {
      this.stream = await navigator.mediaDevices.getUserMedia({ video: { facingMode: 'environment' }, audio: false });
    } catch {
      this.message.set('The camera could not be opened (permission refused or no camera): read a photo of the label instead.');
      return;
    }
    this.scanning.set(true);
    queueMicrotask(() => void this.play());
  }

  protected stop(): void {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    this.stream?.getTracks().forEach((t) => t.stop());
    this.stream = null;
    this.scanning.set(false);
  }

  protected async readPhoto(event: Event): Promise<void> {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    this.message.set('Reading the photo…');
    try {
      this.follow(await decodeQrFile(file));
    } catch {
      this.message.set('That file could not be read as a picture.');
    }
  }

  private async play(): Promise<void> {
    const el = this.video()?.nativeElement;
    if (!el || !this.stream) return;
    el.srcObject = this.stream;
    await el.play().catch(() => undefined);
    const frame = async () => {
      if (!this.stream) return;
      const text = el.videoWidth ? await decodeQr(el, el.videoWidth, el.videoHeight) : null;
      if (text && this.follow(text)) return;
      this.timer = setTimeout(() => void frame(), FRAME_MS);
    };
    void frame();
  }

  /** Opens the plant's sheet for a plant label's text; says why not otherwise. Whether it opened. */
  private follow(text: string | null): boolean {
    if (text === null) {
      this.message.set('No code found: hold the label flat, in good light, filling about a third of the picture.');
      return false;
    }
    const plantId = plantIdFromScan(text);
    if (plantId === null) {
      this.message.set('That code is not a Hueledger plant label.');
      return false;
    }
    this.stop();
    void this.router.navigate(['/record/plant', plantId]);
    return true;
  }
}

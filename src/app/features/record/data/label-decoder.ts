// Reads the QR code of a plant label from a camera frame or a photo: the browser's own
// BarcodeDetector where it has one (Shape Detection API), else jsQR on the pixels.

/** The part of the Shape Detection API used here (not yet in TypeScript's DOM types). */
interface BarcodeDetectorLike {
  detect(source: CanvasImageSource): Promise<{ rawValue: string }[]>;
}
type BarcodeDetectorConstructor = new (options: { formats: string[] }) => BarcodeDetectorLike;

let detector: BarcodeDetectorLike | null | undefined;

/** The browser's QR detector, or null when it has none (then jsQR reads the pixels). */
function nativeDetector(): BarcodeDetectorLike | null {
  if (detector !== undefined) return detector;
  const ctor = (globalThis as { BarcodeDetector?: BarcodeDetectorConstructor }).BarcodeDetector;
  try {
    detector = ctor ? new ctor({ formats: ['qr_code'] }) : null;
  } catch {
    detector = null;
  }
  return detector;
}

/** Largest side a frame is scaled to before jsQR reads it (our own: enough for a label filling a fifth of the frame). */
const MAX_SIDE = 1280;

/** The text of the first QR code in an image, video frame or canvas; null when none is found. */
export async function decodeQr(source: HTMLVideoElement | ImageBitmap | HTMLCanvasElement, width: number, height: number): Promise<string | null> {
  const native = nativeDetector();
  if (native) {
    try {
      const found = await native.detect(source);
      if (found.length) return found[0]!.rawValue;
    } catch {
      // Fall through to jsQR: some platforms list the API but cannot run it.
    }
  }
  const scale = Math.min(1, MAX_SIDE / Math.max(width, height));
  const w = Math.max(1, Math.round(width * scale));
  const h = Math.max(1, Math.round(height * scale));
  const canvas = document.createElement('canvas');
  canvas.width = w;
  canvas.height = h;
  const context = canvas.getContext('2d', { willReadFrequently: true });
  if (!context) return null;
  context.drawImage(source, 0, 0, w, h);
  const pixels = context.getImageData(0, 0, w, h);
  const { default: jsQR } = await import('jsqr');
  return jsQR(pixels.data, w, h)?.data ?? null;
}

/** The text of the QR code in a photo file (a picture of the label); null when none is found. */
export async function decodeQrFile(file: Blob): Promise<string | null> {
  const bitmap = await createImageBitmap(file);
  try {
    return await decodeQr(bitmap, bitmap.width, bitmap.height);
  } finally {
    bitmap.close();
  }
}

// Saving a downloaded file from memory: the export arrives through HttpClient (so it carries the
// session, shows progress and fails through the app's error handling), then is handed to the browser.
import { HttpEventType, type HttpEvent, type HttpHeaders } from '@angular/common/http';

/** Where a download has got to. */
export type DownloadProgress = { kind: 'progress'; loaded: number; fraction: number | null } | { kind: 'done'; blob: Blob; filename: string };

/** Reads one HttpClient event of a blob download; null for events that say nothing new. */
export function downloadStep(event: HttpEvent<Blob>, fallbackName: string): DownloadProgress | null {
  if (event.type === HttpEventType.DownloadProgress) return { kind: 'progress', loaded: event.loaded, fraction: event.total ? event.loaded / event.total : null };
  if (event.type === HttpEventType.Response && event.body) return { kind: 'done', blob: event.body, filename: filenameFrom(event.headers, fallbackName) };
  return null;
}

/** The file name a Content-Disposition header gives (RFC 6266: `filename*` before `filename`), or the fallback. */
export function filenameFrom(headers: HttpHeaders, fallback: string): string {
  const value = headers.get('Content-Disposition') ?? '';
  const extended = /filename\*\s*=\s*(?:UTF-8|utf-8)''([^;]+)/.exec(value);
  if (extended) {
    try {
      return safeName(decodeURIComponent(extended[1].trim()), fallback);
    } catch {
      // A malformed escape: fall through to the plain name.
    }
  }
  const plain = /filename\s*=\s*"?([^";]+)"?/.exec(value);
  return plain ? safeName(plain[1].trim(), fallback) : fallback;
}

/** Only the last path part, never empty. */
function safeName(name: string, fallback: string): string {
  const last = name.split(/[\\/]/).pop()?.trim();
  return last ? last : fallback;
}

/** Hands a blob to the browser as a download with this name. */
export function saveBlob(blob: Blob, filename: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = filename;
  link.style.display = 'none';
  document.body.appendChild(link);
  link.click();
  link.remove();
  // Revoked later: some browsers read the URL after click() returns.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

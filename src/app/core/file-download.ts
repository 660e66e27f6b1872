import { DOCUMENT, Injectable, inject } from '@angular/core';

/**
 * Saves a file the app received or made (an export, a template, a CSV made on the device) on the device. Exports come
 * through `HttpClient` as blobs rather than plain links because the API needs the bearer token,
 * which a link cannot carry. A service so specs can see what would be saved without a download.
 */
@Injectable({ providedIn: 'root' })
export class FileDownload {
  private readonly document = inject(DOCUMENT);

  /** Offers `blob` as a download named `fileName`. */
  save(blob: Blob, fileName: string): void {
    const url = URL.createObjectURL(blob);
    const link = this.document.createElement('a');
    link.href = url;
    link.download = fileName;
    link.style.display = 'none';
    this.document.body.appendChild(link);
    link.click();
    link.remove();
    // Revoked after the click has been handled: revoking at once cancels the download in some browsers.
    setTimeout(() => URL.revokeObjectURL(url), 1000);
  }

  /**
   * Offers generated `text` (a CSV made on the device) as a download named `fileName`; works offline,
   * since nothing leaves the browser. A byte-order mark goes first so spreadsheet programs read UTF-8
   * names (e.g. "Zoë") correctly.
   */
  saveText(fileName: string, text: string, mimeType = 'text/csv;charset=utf-8'): void {
    this.save(new Blob(['\ufeff', text], { type: mimeType }), fileName);
  }
}

/**
 * The file name a `Content-Disposition` header gives (`filename*=UTF-8''…` preferred over
 * `filename="…"`), or `fallback` when it gives none. Path separators are dropped so a name can
 * never point outside the downloads folder.
 */
export function attachmentName(contentDisposition: string | null, fallback: string): string {
  if (!contentDisposition) return fallback;
  const extended = /filename\*\s*=\s*(?:UTF-8|utf-8)''([^;]+)/.exec(contentDisposition);
  let name: string | null = null;
  if (extended?.[1]) {
    try {
      name = decodeURIComponent(extended[1].trim());
    } catch {
      name = null;
    }
  }
  if (name === null) {
    const plain = /filename\s*=\s*(?:"([^"]*)"|([^;]+))/.exec(contentDisposition);
    name = (plain?.[1] ?? plain?.[2] ?? '').trim() || null;
  }
  const safe = name?.replace(/[/\\]/g, '_').trim();
  return safe ? safe : fallback;
}

import { DOCUMENT, Injectable, inject } from '@angular/core';

/**
 * Saves generated text (the CSV export) as a file on the device. A service so the Squad week
 * spec can see what would be saved without a real download; works offline, since nothing
 * leaves the browser.
 */
@Injectable({ providedIn: 'root' })
export class TextDownload {
  private readonly document = inject(DOCUMENT);

  /** Offers `text` as a download named `fileName`. */
  save(fileName: string, text: string, mimeType = 'text/csv;charset=utf-8'): void {
    // A byte-order mark so spreadsheet programs read the UTF-8 names (e.g. "Zoë") correctly.
    const blob = new Blob(['\ufeff', text], { type: mimeType });
    const url = URL.createObjectURL(blob);
    const link = this.document.createElement('a');
    link.href = url;
    link.download = fileName;
    link.style.display = 'none';
    this.document.body.appendChild(link);
    link.click();
    link.remove();
    setTimeout(() => URL.revokeObjectURL(url), 0);
  }
}

import { HttpClient, HttpEvent, HttpEventType, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, filter, map } from 'rxjs';
import type { ImportAnswer, KickMapping, KicksSummary, RosterSummary, UploadEvent } from './import-types';

/**
 * The two CSV uploads (docs/design.md §8): the club roster (admin) and a measuring device's kicks (staff).
 * Both are previewed first (`dryRun=true`: the server reads and checks every row, writes nothing)
 * and then committed all-or-nothing with the same file. Each call reports upload progress, so a
 * large file on a weak connection shows how far it has got instead of a frozen screen.
 *
 * Provided on the imports route together with {@link provideUploadHttp} (not in root): only that
 * client can report upload progress.
 */
@Injectable()
export class ImportApi {
  private readonly http = inject(HttpClient);

  /** Previews (`dryRun`) or commits a roster file. */
  roster(file: File, dryRun: boolean): Observable<UploadEvent<ImportAnswer<RosterSummary>>> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.upload<ImportAnswer<RosterSummary>>('/api/imports/roster', body, dryRun);
  }

  /** Previews (`dryRun`) or commits a device's kick file read with `mapping`. */
  kicks(file: File, mapping: KickMapping, dryRun: boolean): Observable<UploadEvent<ImportAnswer<KicksSummary>>> {
    const body = new FormData();
    // The mapping goes first so the server knows how to read the file before the file arrives.
    body.append('mapping', JSON.stringify(mapping));
    body.append('file', file, file.name);
    return this.upload<ImportAnswer<KicksSummary>>('/api/imports/kicks', body, dryRun);
  }

  private upload<T>(url: string, body: FormData, dryRun: boolean): Observable<UploadEvent<T>> {
    const params = new HttpParams().set('dryRun', String(dryRun));
    // Past the service worker: an upload has nothing to cache, and a request the worker relays
    // reports no upload progress in Chromium.
    const headers = { 'ngsw-bypass': 'true' };
    return this.http.post<T>(url, body, { params, headers, observe: 'events', reportProgress: true }).pipe(
      map((event) => toUploadEvent(event)),
      filter((event): event is UploadEvent<T> => event !== null),
    );
  }
}

/** The events a screen cares about: bytes sent so far, and the answer. */
function toUploadEvent<T>(event: HttpEvent<T>): UploadEvent<T> | null {
  if (event.type === HttpEventType.UploadProgress) {
    return { kind: 'progress', loadedBytes: event.loaded, totalBytes: event.total ?? null };
  }
  if (event.type === HttpEventType.Response) {
    if (event.body === null) {
      // A proxy or a half-finished server route: say so rather than leave the wizard waiting.
      throw new Error('The server answered without a result. Try again.');
    }
    return { kind: 'done', answer: event.body };
  }
  return null;
}

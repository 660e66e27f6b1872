import { HttpClient, HttpErrorResponse, HttpParams, type HttpResponse } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, from, map, switchMap, throwError } from 'rxjs';
import { attachmentName } from './file-download';

/** A file the server sent as an attachment. */
export interface ReceivedFile {
  readonly blob: Blob;
  /** The name the server gave it (or a sensible one when it gave none). */
  readonly fileName: string;
}

/** What a kicks export covers: one squad or one player, and the days from `from` to `to` inclusive. */
export type KickExportQuery = ({ readonly squadId: string } | { readonly playerId: string }) & {
  /** First day, YYYY-MM-DD. */
  readonly from: string;
  /** Last day, YYYY-MM-DD (included). */
  readonly to: string;
};

/**
 * Exports: kicks as CSV for a squad or a player over a date range (staff), and all the
 * data held about one player as JSON for a data-access request (admin). Fetched as blobs through
 * `HttpClient` because the API wants the bearer token, which a plain download link cannot send;
 * a refusal arrives as a blob too and is turned back into the usual error body here, so screens
 * can show the server's message.
 */
@Injectable({ providedIn: 'root' })
export class ExportApi {
  private readonly http = inject(HttpClient);

  /** `GET /api/exports/kicks.csv` for the query. */
  kicksCsv(query: KickExportQuery): Observable<ReceivedFile> {
    let params = new HttpParams().set('from', query.from).set('to', query.to);
    params = 'squadId' in query ? params.set('squadId', query.squadId) : params.set('playerId', query.playerId);
    return this.file('/api/exports/kicks.csv', params, `loftline-kicks-${query.from}-${query.to}.csv`);
  }

  /** `GET /api/exports/players/:id.json`: everything Loftline holds about the player. */
  playerData(playerId: string): Observable<ReceivedFile> {
    return this.file(`/api/exports/players/${encodeURIComponent(playerId)}.json`, new HttpParams(), `loftline-player-${playerId}.json`);
  }

  private file(url: string, params: HttpParams, fallbackName: string): Observable<ReceivedFile> {
    return this.http.get(url, { params, responseType: 'blob', observe: 'response' }).pipe(
      map((response: HttpResponse<Blob>) => {
        if (response.body === null) {
          throw new Error('The server sent an empty answer instead of the file. Try again.');
        }
        return { blob: response.body, fileName: attachmentName(response.headers.get('Content-Disposition'), fallbackName) };
      }),
      catchError((error: unknown) => withParsedBody(error)),
    );
  }
}

/**
 * Re-throws a failed blob request with its body read as JSON when it is JSON, so
 * `describeApiError` finds the server's `{ error: { message } }` as with any other call.
 */
export function withParsedBody(error: unknown): Observable<never> {
  if (!(error instanceof HttpErrorResponse) || !(error.error instanceof Blob)) {
    return throwError(() => error);
  }
  return from(error.error.text()).pipe(
    switchMap((text) => {
      let body: unknown = text;
      try {
        body = JSON.parse(text);
      } catch {
        // Not JSON (a proxy's HTML page): keep the text; the status still says what happened.
      }
      return throwError(
        () =>
          new HttpErrorResponse({
            error: body,
            headers: error.headers,
            status: error.status,
            statusText: error.statusText,
            url: error.url ?? undefined,
          }),
      );
    }),
  );
}

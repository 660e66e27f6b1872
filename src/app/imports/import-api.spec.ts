import {
  HttpBackend,
  HttpErrorResponse,
  HttpEventType,
  HttpXhrBackend,
  FetchBackend,
  provideHttpClient,
  withFetch,
} from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { EnvironmentInjector, createEnvironmentInjector, provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom, toArray } from 'rxjs';
import { ImportApi } from './import-api';
import { describeImportFailure } from './import-problem';
import type { ImportAnswer, KickMapping, KicksSummary, UploadEvent } from './import-types';
import { provideUploadHttp } from './upload-http';

const MAPPING: KickMapping = {
  squadId: '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f1b01',
  technique: 'lofted',
  targetDistanceM: 30,
  targetRadiusM: 3,
  device: 'Pitch radar A',
  columns: { player: 'Kicker', speed: 'Ball speed (mph)' },
  units: { speed: 'mph', spin: 'rev/s', distance: 'm' },
};
const ANSWER: ImportAnswer<KicksSummary> = {
  dryRun: true,
  uploadId: null,
  alreadyImported: false,
  rows: 2,
  errors: [],
  summary: { kicksCreated: 2, kicksSkipped: 0, sessionId: null },
};

describe('ImportApi', () => {
  let api: ImportApi;
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideZonelessChangeDetection(), provideHttpClient(), provideHttpClientTesting(), ImportApi],
    });
    api = TestBed.inject(ImportApi);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  it('sends the file and the mapping as multipart with the dry-run flag, past the service worker', async () => {
    const file = new File(['Kicker,Ball speed (mph)\n7,58\n'], 'kicks.csv', { type: 'text/csv' });
    const events = firstValueFrom(api.kicks(file, MAPPING, true).pipe(toArray()));
    const request = backend.expectOne((r) => r.url === '/api/imports/kicks');
    expect(request.request.method).toBe('POST');
    expect(request.request.params.get('dryRun')).toBe('true');
    expect(request.request.reportProgress).toBeTrue();
    expect(request.request.headers.get('ngsw-bypass')).toBe('true');
    const body = request.request.body as FormData;
    expect(JSON.parse(String(body.get('mapping')))).toEqual(MAPPING);
    expect((body.get('file') as File).name).toBe('kicks.csv');

    request.event({ type: HttpEventType.UploadProgress, loaded: 10, total: 40 });
    request.event({ type: HttpEventType.DownloadProgress, loaded: 5 });
    request.flush(ANSWER);
    const expected: UploadEvent<ImportAnswer<KicksSummary>>[] = [
      { kind: 'progress', loadedBytes: 10, totalBytes: 40 },
      { kind: 'done', answer: ANSWER },
    ];
    expect(await events).toEqual(expected);
  });

  it('commits a roster file without the dry-run flag set', () => {
    api.roster(new File(['squad,name\nU14,Ada\n'], 'roster.csv'), false).subscribe();
    const request = backend.expectOne('/api/imports/roster?dryRun=false');
    expect((request.request.body as FormData).get('mapping')).toBeNull();
    request.flush({ ...ANSWER, dryRun: false });
  });

  it('passes a refused commit on with its per-row errors', async () => {
    const result = firstValueFrom(api.roster(new File(['x'], 'r.csv'), false)).catch((error: unknown) => describeImportFailure(error));
    backend.expectOne('/api/imports/roster?dryRun=false').flush(
      {
        error: { code: 'import_invalid', message: 'The file has 1 problem; nothing was imported' },
        errors: [{ row: 3, column: 'foot', message: 'Foot must be left or right' }, { row: 'x' }],
      },
      { status: 400, statusText: 'Bad Request' },
    );
    expect(await result).toEqual({
      message: 'The file has 1 problem; nothing was imported',
      unreachable: false,
      code: 'import_invalid',
      rowErrors: [{ row: 3, column: 'foot', message: 'Foot must be left or right' }],
    });
  });
});

describe('describeImportFailure', () => {
  it('says that the server cannot be reached when there was no answer', () => {
    const refusal = describeImportFailure(new HttpErrorResponse({ status: 0 }));
    expect(refusal.unreachable).toBeTrue();
    expect(refusal.message).toContain('cannot be reached');
  });

  it('words a proxy’s 413 as the size limit', () => {
    expect(describeImportFailure(new HttpErrorResponse({ status: 413, error: '<html>' })).message).toContain(
      'larger than the server accepts (5 MB)',
    );
  });

  it('keeps the message of a failure on the device', () => {
    expect(describeImportFailure(new Error('The server answered without a result. Try again.')).message).toBe(
      'The server answered without a result. Try again.',
    );
  });
});

describe('provideUploadHttp', () => {
  it('sends uploads through XMLHttpRequest even when the app’s client uses fetch', () => {
    TestBed.configureTestingModule({ providers: [provideZonelessChangeDetection(), provideHttpClient(withFetch())] });
    const root = TestBed.inject(EnvironmentInjector);
    expect(root.get(HttpBackend)).toBeInstanceOf(FetchBackend);
    const uploads = createEnvironmentInjector([...provideUploadHttp(), ImportApi], root);
    expect(uploads.get(HttpBackend)).toBeInstanceOf(HttpXhrBackend);
    uploads.destroy();
  });
});

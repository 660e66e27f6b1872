import type { Technique } from '../../../shared/schemas/sync';

/*
 * The import contract as the client sees it: what `POST /api/imports/roster` and
 * `POST /api/imports/kicks` take and answer. Written down here, next to the screens that use it,
 * because the answers are plain JSON and the screens must not guess at their shape.
 */

/** One problem with one cell (or row) of an upload. */
export interface ImportRowError {
  /** The row's line number in the file: the header row is 1, so the first data row is 2. */
  readonly row: number;
  /** The column the problem is in, as the file's header names it. */
  readonly column: string;
  /** Why the row was refused, worded by the server for the coach. */
  readonly message: string;
}

/** A preview (`dryRun=true`) or commit answer of either import. */
export interface ImportAnswer<S> {
  /** Whether nothing was written (a preview). */
  readonly dryRun: boolean;
  /** The stored upload, once committed (null for a preview). */
  readonly uploadId: string | null;
  /** Whether this exact file was committed before, so nothing was applied again. */
  readonly alreadyImported: boolean;
  /** Data rows the server read. */
  readonly rows: number;
  readonly errors: readonly ImportRowError[];
  readonly summary: S;
}

/** What a roster import did (commit) or would do (preview). */
export interface RosterSummary {
  readonly squadsCreated: number;
  readonly playersCreated: number;
  readonly playersUpdated: number;
  readonly guardiansCreated: number;
  readonly linksCreated: number;
}

/** What a measured-kick import did (commit) or would do (preview). */
export interface KicksSummary {
  readonly kicksCreated: number;
  readonly kicksSkipped: number;
  /** The training session the kicks were filed under (null for a preview). */
  readonly sessionId: string | null;
}

/** Speed units a device may export. */
export type SpeedUnit = 'm/s' | 'km/h' | 'mph';
/** Spin units a device may export. */
export type SpinUnit = 'rev/s' | 'rpm';
/** Distance units a device may export. */
export type DistanceUnit = 'm' | 'yd';

/** The units of a device's columns. */
export interface KickUnits {
  readonly speed: SpeedUnit;
  readonly spin: SpinUnit;
  readonly distance: DistanceUnit;
}

/** The fields of a kick a device column can fill. */
export type KickField = 'player' | 'time' | 'speed' | 'launchAngle' | 'spin' | 'carry' | 'lateral';

/** Which CSV column (by its header name) fills which field; only `player` is required. */
export type KickColumns = { readonly player: string } & Partial<Readonly<Record<Exclude<KickField, 'player'>, string>>>;

/** The `mapping` part of a measured-kick upload. */
export interface KickMapping {
  readonly squadId: string;
  readonly technique: Technique;
  readonly targetDistanceM: number;
  readonly targetRadiusM: number;
  /** The device's name, as the coach calls it; the mapping is remembered under it. */
  readonly device?: string;
  readonly columns: KickColumns;
  readonly units: KickUnits;
}

/** Progress or the end of one upload. */
export type UploadEvent<T> =
  | { readonly kind: 'progress'; readonly loadedBytes: number; readonly totalBytes: number | null }
  | { readonly kind: 'done'; readonly answer: T };

/** Largest file the server accepts (it refuses bigger ones; checked here first to save the upload). */
export const MAX_UPLOAD_BYTES = 5 * 1024 * 1024;
/** Most data rows the server accepts in one file. */
export const MAX_UPLOAD_ROWS = 50_000;

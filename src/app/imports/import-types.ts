import type { Technique } from '../../../shared/schemas/sync';

/*
 * The import contract as the client sees it: what `POST /api/imports/roster` and
 * `POST /api/imports/kicks` take (here, next to the screens that build it) and answer (the shared schemas).
 */

/** The answers, defined once in shared/ (server, client and the OpenAPI document use the same shapes). */
export type { ImportAnswer, ImportRowError, KicksSummary, RosterSummary } from '../../../shared/schemas/imports';

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

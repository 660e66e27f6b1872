import type { Foot } from '../vocabulary';

/** A squad as `GET /api/squads` lists it (scoped to the caller). */
export interface SquadSummary {
  id: string;
  name: string;
  ageGroup: string;
  /** Ball size the squad trains with (3, 4 or 5). */
  ballSize: number;
  playerCount: number;
  /**
   * Where the squad usually trains (altitude and kicking bearing for session conditions), cached on
   * the phone with the squad so a session started with no signal still gets the ground's altitude.
   * Absent from older servers' answers.
   */
  ground?: SquadGround | null;
}

/** The ground facts Pitchside needs at session start. */
export interface SquadGround {
  id: string;
  name: string;
  altitudeM: number;
  /** Compass bearing of the main kicking direction (0 = north, 90 = east). */
  kickingBearingDeg: number;
}

/** A player as `GET /api/players` lists it (scoped to the caller). */
export interface PlayerSummary {
  id: string;
  squadId: string;
  squadName: string;
  displayName: string;
  shirtNumber: number | null;
  dominantFoot: Foot;
  /** Whether the player is under 18 (academy youth data rules apply). */
  isMinor: boolean;
}

/** The error body every failing API call answers with. */
export interface ApiErrorBody {
  error: {
    code: string;
    message: string;
    /** For validation failures: each offending field (dotted path) and why. */
    fields?: { field: string; message: string }[];
  };
}

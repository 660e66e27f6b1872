/**
 * Who is in the demo academy. Every name here is invented for Loftline's fictional
 * Kestrel Vale Athletic Academy; any resemblance to a real person is unintended.
 *
 * Kept as plain data so the scenario code stays about generation, and so the people the demo
 * is built around (the five demo accounts, the strong improvers, the player who regresses, the
 * two who sometimes kick past the load limit) can be found in one place.
 */
import type { Role } from '../shared/roles';

/** The only e-mail domain the demo uses (reserved `.test` TLD, never deliverable). */
export const DEMO_EMAIL_DOMAIN = 'kestrel-vale.test';

/** Key of one of the three demo squads. */
export type SquadKey = 'u14' | 'u16' | 'first';

/** A squad, its ball, and when it trains (London wall-clock time). */
export interface SquadSpec {
  key: SquadKey;
  name: string;
  ageGroup: string;
  ballSize: 4 | 5;
  /** Player ages (fractional years at the load date) are drawn from this range. */
  ageRangeYears: [number, number];
  /** Two weekly sessions: ISO weekday (1 = Monday), hour, minute, length in minutes. */
  sessionSlots: { isoWeekday: number; hour: number; minute: number; durationMin: number }[];
}

/** How a player's kicking develops over the eight weeks (see `outcomes.ts`). */
export type ProgressProfile = 'typical' | 'strong' | 'regressing';

/** A player on one of the squads. */
export interface PlayerSpec {
  key: string;
  squad: SquadKey;
  displayName: string;
  progress: ProgressProfile;
  /** Stays on after drills now and then, so their session count passes the club's rep limit. */
  extraWork?: boolean;
  /** E-mail of the player's own account, when they have one. */
  accountEmail?: string;
}

/** A staff account and the squads it works with. */
export interface StaffSpec {
  key: string;
  email: string;
  displayName: string;
  role: Extract<Role, 'admin' | 'head_coach' | 'assistant_coach'>;
  squads: SquadKey[];
  disabled?: boolean;
}

/** Whether a guardian link has consent recorded, and whether the guardian wants the digest. */
export type ConsentState = 'opted_in' | 'consented_opted_out' | 'none';

/** A guardian account and the children it is linked to. */
export interface GuardianSpec {
  displayName: string;
  email: string;
  children: { playerKey: string; relationship: string; consent: ConsentState }[];
}

/** The academy's three squads. Youth train on weekday evenings, the first team in the morning. */
export const SQUADS: readonly SquadSpec[] = [
  {
    key: 'u14',
    name: 'U14',
    ageGroup: 'U14',
    ballSize: 4,
    ageRangeYears: [12.6, 13.9],
    sessionSlots: [
      { isoWeekday: 2, hour: 18, minute: 0, durationMin: 75 },
      { isoWeekday: 4, hour: 18, minute: 0, durationMin: 75 },
    ],
  },
  {
    key: 'u16',
    name: 'U16',
    ageGroup: 'U16',
    ballSize: 5,
    ageRangeYears: [14.6, 15.9],
    sessionSlots: [
      { isoWeekday: 2, hour: 19, minute: 30, durationMin: 90 },
      { isoWeekday: 4, hour: 19, minute: 30, durationMin: 90 },
    ],
  },
  {
    key: 'first',
    name: 'First team',
    ageGroup: 'First team',
    ballSize: 5,
    ageRangeYears: [18.3, 30.7],
    sessionSlots: [
      { isoWeekday: 3, hour: 10, minute: 30, durationMin: 90 },
      { isoWeekday: 5, hour: 10, minute: 0, durationMin: 90 },
    ],
  },
];

/** Turns "Given Family-Name" into "given.family-name@kestrel-vale.test". */
export function demoEmail(displayName: string): string {
  const local = displayName
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z\s-]/g, '')
    .trim()
    .split(/\s+/)
    .join('.');
  return `${local}@${DEMO_EMAIL_DOMAIN}`;
}

/** Key of a player from their name ("Nia Okafor-Blythe" → "nia-okafor-blythe"). */
export function playerKey(displayName: string): string {
  return (demoEmail(displayName).split('@')[0] ?? '').replace(/\./g, '-');
}

const p = (squad: SquadKey, displayName: string, extra: Partial<PlayerSpec> = {}): PlayerSpec => ({
  key: playerKey(displayName),
  squad,
  displayName,
  progress: 'typical',
  ...extra,
});

/** 45 players, 15 per squad. */
export const PLAYERS: readonly PlayerSpec[] = [
  p('u14', 'Tobias Marchetti-Reed'),
  p('u14', 'Nia Okafor-Blythe'),
  p('u14', 'Rafi Demirel'),
  p('u14', 'Callum Ashdown'),
  p('u14', 'Ishaan Mehrotra'),
  p('u14', 'Leo Brannock'),
  p('u14', 'Maya Lindgarde'),
  p('u14', 'Kwame Adjei-Foster', { progress: 'strong' }),
  p('u14', 'Orla Fennimore'),
  p('u14', 'Jonah Whitcombe'),
  p('u14', 'Sami Khoury-Lane'),
  p('u14', 'Elif Yavuzer'),
  p('u14', 'Dara Quillan'),
  p('u14', 'Mateo Ferreira-Holt'),
  p('u14', 'Ben Okwuosa'),
  p('u16', 'Amara Nwosu-Pike'),
  p('u16', 'Finlay Drummond-Shaw', { accountEmail: `player@${DEMO_EMAIL_DOMAIN}` }),
  p('u16', 'Yusuf Demirel'),
  p('u16', 'Theo Castellane', { extraWork: true }),
  p('u16', 'Priya Raghunathan', { progress: 'strong' }),
  p('u16', 'Kieran Mulvaney'),
  p('u16', 'Zain Chaudhry-Wells'),
  p('u16', 'Lucas Brennaugh'),
  p('u16', 'Aoife Tierney-Cole'),
  p('u16', 'Dominic Ashworth-Kay'),
  p('u16', 'Emeka Obiorah'),
  p('u16', 'Jakub Sadowicz'),
  p('u16', 'Hana Takeda-Moss'),
  p('u16', 'Kofi Adjei-Foster'),
  p('u16', 'Ciaran Blakemore'),
  p('first', 'Marcus Adebanjo-Reeve'),
  p('first', 'Tomasz Kerlinski'),
  p('first', 'Elliot Fairbrook'),
  p('first', 'Dev Kapadia', { accountEmail: demoEmail('Dev Kapadia') }),
  p('first', 'Niall Corrigan'),
  p('first', 'Oscar Lindmark'),
  p('first', 'Jamal Whitlock-Ayre'),
  p('first', 'Rhys Penhallow', { extraWork: true, accountEmail: demoEmail('Rhys Penhallow') }),
  p('first', 'Andre Sequeira-Dunn'),
  p('first', 'Samuel Asante-Corry'),
  p('first', 'Liam Hargest', { progress: 'regressing' }),
  p('first', 'Idris Benhaddou'),
  p('first', 'Felix Ravenscroft', { progress: 'strong' }),
  p('first', 'Chidi Anyanwu-Park'),
  p('first', 'Gareth Pellow'),
];

/** Club staff. The first three are demo accounts; the rest make the staffing rules testable. */
export const STAFF: readonly StaffSpec[] = [
  { key: 'admin', email: `admin@${DEMO_EMAIL_DOMAIN}`, displayName: 'Harriet Quayle', role: 'admin', squads: [] },
  {
    key: 'head_coach',
    email: `head.coach@${DEMO_EMAIL_DOMAIN}`,
    displayName: 'Rosalind Tembo',
    role: 'head_coach',
    squads: ['u14', 'u16', 'first'],
  },
  {
    key: 'assistant_coach',
    email: `assistant.coach@${DEMO_EMAIL_DOMAIN}`,
    displayName: 'Owen Farrant',
    role: 'assistant_coach',
    squads: ['u14', 'u16'],
  },
  {
    key: 'first_team_assistant',
    email: demoEmail('Bashir Kallow'),
    displayName: 'Bashir Kallow',
    role: 'assistant_coach',
    squads: ['first'],
  },
  {
    key: 'kicking_coach',
    email: demoEmail('Ingrid Solheim-Hay'),
    displayName: 'Ingrid Solheim-Hay',
    role: 'assistant_coach',
    squads: ['u16', 'first'],
  },
  // A former coach whose account an administrator switched off: sign-in must refuse it.
  {
    key: 'former_assistant',
    email: demoEmail('Peter Langridge'),
    displayName: 'Peter Langridge',
    role: 'assistant_coach',
    squads: [],
    disabled: true,
  },
];

/** Who records most sessions of each squad on their phone (staff keys with relative weights). */
export const SESSION_RECORDERS: Record<SquadKey, { staffKey: string; weight: number }[]> = {
  u14: [
    { staffKey: 'assistant_coach', weight: 7 },
    { staffKey: 'head_coach', weight: 3 },
  ],
  u16: [
    { staffKey: 'assistant_coach', weight: 5 },
    { staffKey: 'kicking_coach', weight: 3 },
    { staffKey: 'head_coach', weight: 2 },
  ],
  first: [
    { staffKey: 'first_team_assistant', weight: 5 },
    { staffKey: 'kicking_coach', weight: 3 },
    { staffKey: 'head_coach', weight: 2 },
  ],
};

const g = (displayName: string, children: GuardianSpec['children'], email = demoEmail(displayName)): GuardianSpec => ({
  displayName,
  email,
  children,
});
const child = (name: string, relationship: string, consent: ConsentState = 'opted_in') => ({
  playerKey: playerKey(name),
  relationship,
  consent,
});

/**
 * Guardians of the 30 minors. Two guardians have a child in each youth squad, one child has two
 * guardians, and seven links lack an active digest opt-in (five without any consent), so the
 * consent rules have something to refuse.
 */
export const GUARDIANS: readonly GuardianSpec[] = [
  g('Adaeze Okafor-Blythe', [child('Nia Okafor-Blythe', 'parent')], `guardian@${DEMO_EMAIL_DOMAIN}`),
  g('Paola Marchetti', [child('Tobias Marchetti-Reed', 'parent')]),
  g('Simon Reed', [child('Tobias Marchetti-Reed', 'parent', 'none')]),
  g('Selin Demirel', [child('Rafi Demirel', 'parent'), child('Yusuf Demirel', 'parent')]),
  g('Gemma Ashdown', [child('Callum Ashdown', 'parent')]),
  g('Anjali Mehrotra', [child('Ishaan Mehrotra', 'parent')]),
  g('Patrick Brannock', [child('Leo Brannock', 'parent', 'consented_opted_out')]),
  g('Sofie Lindgarde', [child('Maya Lindgarde', 'parent')]),
  g('Efua Adjei-Foster', [child('Kwame Adjei-Foster', 'parent'), child('Kofi Adjei-Foster', 'parent', 'none')]),
  g('Bridget Fennimore', [child('Orla Fennimore', 'grandparent')]),
  g('Graham Whitcombe', [child('Jonah Whitcombe', 'parent', 'none')]),
  g('Rania Khoury', [child('Sami Khoury-Lane', 'parent')]),
  g('Murat Yavuzer', [child('Elif Yavuzer', 'parent')]),
  g('Siobhan Quillan', [child('Dara Quillan', 'parent')]),
  g('Lucia Ferreira', [child('Mateo Ferreira-Holt', 'parent')]),
  g('Chinwe Okwuosa', [child('Ben Okwuosa', 'parent', 'consented_opted_out')]),
  g('Grace Nwosu-Pike', [child('Amara Nwosu-Pike', 'parent')]),
  g('Alasdair Drummond-Shaw', [child('Finlay Drummond-Shaw', 'parent')]),
  g('Juliette Castellane', [child('Theo Castellane', 'parent')]),
  g('Lakshmi Raghunathan', [child('Priya Raghunathan', 'parent')]),
  g('Fiona Mulvaney', [child('Kieran Mulvaney', 'parent', 'none')]),
  g('Sadia Chaudhry-Wells', [child('Zain Chaudhry-Wells', 'parent')]),
  g('Mark Brennaugh', [child('Lucas Brennaugh', 'parent')]),
  g('Niamh Tierney', [child('Aoife Tierney-Cole', 'parent')]),
  g('Helen Ashworth-Kay', [child('Dominic Ashworth-Kay', 'parent')]),
  g('Ngozi Obiorah', [child('Emeka Obiorah', 'parent')]),
  g('Agnieszka Sadowicz', [child('Jakub Sadowicz', 'parent')]),
  g('Keiko Takeda-Moss', [child('Hana Takeda-Moss', 'parent')]),
  g('Deborah Blakemore', [child('Ciaran Blakemore', 'guardian', 'none')]),
];

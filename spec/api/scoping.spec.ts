import { and, eq, inArray, isNull } from 'drizzle-orm';
import request from 'supertest';
import { guardianLinks, players, squads, squadStaff, users } from '../../api/db/schema';
import { createTestApp, OTHER_CLUB, signIn, type TestApp } from './fixture';

interface SquadRow {
  id: string;
  name: string;
  ageGroup: string;
  ballSize: number;
  playerCount: number;
}
interface PlayerRow {
  id: string;
  squadId: string;
  displayName: string;
}

describe('scoping of squads and players', () => {
  let t: TestApp;
  const tokens = new Map<string, string>();

  async function get<T>(email: string, path: string): Promise<{ status: number; body: T }> {
    if (!tokens.has(email)) tokens.set(email, (await signIn(t.app, email)).accessToken);
    const res = await request(t.app)
      .get(path)
      .set('Authorization', `Bearer ${tokens.get(email)}`);
    return { status: res.status, body: res.body as T };
  }
  const squadsOf = async (email: string) => (await get<{ squads: SquadRow[] }>(email, '/api/squads')).body.squads;
  const playersOf = async (email: string) => (await get<{ players: PlayerRow[] }>(email, '/api/players')).body.players;
  const userId = (email: string) => t.db.select().from(users).where(eq(users.email, email)).get()!.id;
  const demoClubId = () => t.db.select().from(users).where(eq(users.email, 'admin@kestrel-vale.test')).get()!.clubId;

  beforeAll(() => {
    t = createTestApp();
  });
  afterAll(() => t.close());

  it('shows the admin every squad and player of the club, and nothing of another club', async () => {
    const s = await squadsOf('admin@kestrel-vale.test');
    expect(s.length).toBe(3);
    const p = await playersOf('admin@kestrel-vale.test');
    const clubPlayers = t.db
      .select()
      .from(players)
      .where(and(eq(players.clubId, demoClubId()), isNull(players.deletedAt)))
      .all();
    expect(p.length).toBe(clubPlayers.length);
    expect(p.length).toBeGreaterThanOrEqual(40);
    expect(p.some((x) => x.id === OTHER_CLUB.playerId)).toBeFalse();
    expect(s.some((x) => x.id === OTHER_CLUB.squadId)).toBeFalse();
  });

  it('shows the head coach the three squads they coach with player counts', async () => {
    const s = await squadsOf('head.coach@kestrel-vale.test');
    expect(s.map((x) => x.ageGroup).sort()).toEqual(['First team', 'U14', 'U16'].sort());
    const u14 = s.find((x) => x.ageGroup === 'U14')!;
    expect(u14.ballSize).toBe(4);
    for (const squad of s) {
      const n = t.db
        .select()
        .from(players)
        .where(and(eq(players.squadId, squad.id), isNull(players.deletedAt)))
        .all().length;
      expect(squad.playerCount).toBe(n);
    }
  });

  it('shows the assistant coach exactly the squads in squad_staff and their players', async () => {
    const email = 'assistant.coach@kestrel-vale.test';
    const staffed = t.db
      .select()
      .from(squadStaff)
      .where(eq(squadStaff.userId, userId(email)))
      .all()
      .map((r) => r.squadId)
      .sort();
    const s = await squadsOf(email);
    expect(s.map((x) => x.id).sort()).toEqual(staffed);
    expect(s.length).toBeLessThan(3);
    const p = await playersOf(email);
    const expected = t.db
      .select()
      .from(players)
      .where(inArray(players.squadId, staffed))
      .all()
      .map((r) => r.id)
      .sort();
    expect(p.map((x) => x.id).sort()).toEqual(expected);
  });

  it('shows a player only themselves and their own squad', async () => {
    const email = 'player@kestrel-vale.test';
    const own = t.db
      .select()
      .from(players)
      .where(eq(players.userId, userId(email)))
      .get()!;
    const p = await playersOf(email);
    expect(p.map((x) => x.id)).toEqual([own.id]);
    const s = await squadsOf(email);
    expect(s.map((x) => x.id)).toEqual([own.squadId]);
    expect(s[0].ageGroup).toBe('U16');
  });

  it('never lets a player read another player', async () => {
    const email = 'player@kestrel-vale.test';
    const own = t.db
      .select()
      .from(players)
      .where(eq(players.userId, userId(email)))
      .get()!;
    const teammate = t.db
      .select()
      .from(players)
      .where(eq(players.squadId, own.squadId))
      .all()
      .find((x) => x.id !== own.id)!;
    expect((await get(email, `/api/players/${teammate.id}`)).status).toBe(404);
    expect((await get<{ players: PlayerRow[] }>(email, `/api/players?squadId=${own.squadId}`)).body.players.length).toBe(1);
    expect((await get(email, `/api/players/${own.id}`)).status).toBe(200);
  });

  it('shows a guardian only their linked child and no squads', async () => {
    const email = 'guardian@kestrel-vale.test';
    const links = t.db
      .select()
      .from(guardianLinks)
      .where(eq(guardianLinks.guardianUserId, userId(email)))
      .all();
    expect(links.length).toBe(1);
    const p = await playersOf(email);
    expect(p.map((x) => x.id)).toEqual([links[0].playerId]);
    const child = t.db.select().from(players).where(eq(players.id, links[0].playerId)).get()!;
    const squad = t.db.select().from(squads).where(eq(squads.id, child.squadId)).get()!;
    expect(squad.ageGroup).toBe('U14');
    expect(await squadsOf(email)).toEqual([]);
    const me = await get<{ childPlayerIds: string[] }>(email, '/api/me');
    expect(me.body.childPlayerIds).toEqual([child.id]);
  });

  it('keeps the other club’s staff inside their own club', async () => {
    const s = await squadsOf(OTHER_CLUB.coachEmail);
    expect(s.map((x) => x.id)).toEqual([OTHER_CLUB.squadId]);
    const p = await playersOf(OTHER_CLUB.coachEmail);
    expect(p.map((x) => x.id)).toEqual([OTHER_CLUB.playerId]);
    const demoPlayer = t.db.select().from(players).where(eq(players.clubId, demoClubId())).get()!;
    expect((await get(OTHER_CLUB.coachEmail, `/api/players/${demoPlayer.id}`)).status).toBe(404);
    expect((await get(OTHER_CLUB.coachEmail, `/api/players?squadId=${demoPlayer.squadId}`)).body).toEqual({ players: [] });
    expect((await get('admin@kestrel-vale.test', `/api/players/${OTHER_CLUB.playerId}`)).status).toBe(404);
  });
});

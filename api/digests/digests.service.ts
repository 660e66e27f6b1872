/**
 * The weekly mail jobs: a Family digest per consenting, opted-in guardian link and a Squad week
 * summary per head coach. Safe to run twice or from two processes at once: each (recipient,
 * week) has a unique key in `mail_outbox`, so a second run queues nothing new.
 */
import { DEFAULT_REP_LIMIT_PER_SESSION } from '../../shared/schemas/club';
import { randomUUID } from 'node:crypto';
import { and, eq, inArray } from 'drizzle-orm';
import type { DigestRunResult } from '../../shared/schemas/mail';
import type { AppConfig } from '../config';
import type { Db } from '../db/client';
import { clubs, digestRuns, guardianLinks, players, squads, squadStaff, users } from '../db/schema';
import { firstNameOf } from '../guardians/guardians.service';
import type { Mailer } from '../mail/mailer';
import { familyDigestMail, squadWeekMail } from '../mail/templates';
import { addDays, isAdultOn, isoWeekStart } from '../../shared/dates';
import { clubFormat } from '../club/club.service';
import type { QuantityFormat } from '../../shared/quantity-format';
import { barChartPng } from './chart-png';
import { unsubscribeToken } from './unsubscribe-token';

/** Weeks shown in the digest chart. */
const CHART_WEEKS = 6;

/** Monday of the last complete ISO week before `now`. */
export function lastCompleteWeek(now: Date): string {
  return addDays(isoWeekStart(now.toISOString().slice(0, 10)), -7);
}

/** Runs the weekly digests of one club (or every club) for the week starting `weekStart`. */
export class DigestJob {
  constructor(
    private readonly db: Db,
    private readonly mailer: Mailer,
    private readonly config: AppConfig,
  ) {}

  /** Queues and sends the week's digests; returns what was queued this time. */
  async run(options: { clubId?: string; weekStart?: string; now?: Date } = {}): Promise<DigestRunResult> {
    const weekStart = options.weekStart ? isoWeekStart(options.weekStart) : lastCompleteWeek(options.now ?? new Date());
    const clubIds = options.clubId
      ? [options.clubId]
      : this.db
          .select({ id: clubs.id })
          .from(clubs)
          .all()
          .map((c) => c.id);
    const total: DigestRunResult = { weekStart, familySent: 0, familySkipped: 0, squadWeekSent: 0 };
    for (const clubId of clubIds) {
      this.db
        .insert(digestRuns)
        .values({ id: randomUUID(), clubId, kind: 'family_digest', periodStart: weekStart })
        .onConflictDoNothing()
        .run();
      const family = this.queueFamily(clubId, weekStart);
      total.familySent += family.sent;
      total.familySkipped += family.skipped;
      total.squadWeekSent += this.queueSquadWeek(clubId, weekStart);
      this.db
        .update(digestRuns)
        .set({ status: 'done', finishedAt: new Date().toISOString() })
        .where(and(eq(digestRuns.clubId, clubId), eq(digestRuns.kind, 'family_digest'), eq(digestRuns.periodStart, weekStart)))
        .run();
    }
    await this.mailer.flush();
    return total;
  }

  private queueFamily(clubId: string, weekStart: string): { sent: number; skipped: number } {
    const club = this.db.select().from(clubs).where(eq(clubs.id, clubId)).get();
    // The mail speaks the club's units and locale ("34,3 yd", "23. Nov. 2026").
    const f = clubFormat(this.db, clubId);
    const weekEnd = addDays(weekStart, 7);
    const links = this.db
      .select({ link: guardianLinks, player: players, guardian: users })
      .from(guardianLinks)
      .innerJoin(players, eq(players.id, guardianLinks.playerId))
      .innerJoin(users, eq(users.id, guardianLinks.guardianUserId))
      .where(eq(players.clubId, clubId))
      .all();
    let sent = 0;
    let skipped = 0;
    for (const { link, player, guardian } of links) {
      const consenting = link.consentAt !== null && link.consentWithdrawnAt === null && link.digestOptIn;
      const allowedByAge = !isAdultOn(player.birthDate, weekEnd) || player.digestSelfOptIn;
      if (!consenting || !allowedByAge || player.deletedAt || guardian.disabledAt) {
        skipped++;
        continue;
      }
      const weeks = this.weeklyFigures(player.id, addDays(weekStart, -7 * (CHART_WEEKS - 1)), weekEnd);
      const current = weeks.at(-1)!;
      const previous = weeks.slice(0, -1).filter((w) => w.reps > 0);
      const prevRate = previous.length
        ? previous.reduce((a, w) => a + (w.hitRate ?? 0) * w.reps, 0) / previous.reduce((a, w) => a + w.reps, 0)
        : null;
      const trend =
        current.hitRate === null || prevRate === null
          ? 'Not enough repetitions yet to show a trend.'
          : current.hitRate > prevRate + 0.03
            ? 'That is up on the previous weeks.'
            : current.hitRate < prevRate - 0.03
              ? 'That is a little down on the previous weeks.'
              : 'That is about the same as the previous weeks.';
      const highlight = this.highlight(player.id, weekStart, weekEnd, f);
      const token = unsubscribeToken(this.config.jwtSecret, link.id);
      const oneClick = `${this.config.publicUrl}/api/digests/unsubscribe?token=${token}`;
      const visible = `${this.config.publicUrl}/unsubscribe?token=${token}`;
      const chartCid = `week-chart-${link.id}@loftline`;
      const mail = familyDigestMail({
        guardianName: guardian.displayName,
        firstName: firstNameOf(player.displayName),
        clubName: club?.name ?? 'your club',
        weekLabel: f.day(weekStart, true),
        reps: current.reps,
        hitRate: current.hitRate === null ? null : f.percent(current.hitRate),
        trend,
        highlight,
        chartCid,
        unsubscribeLink: visible,
      });
      const queued = this.mailer.queue({
        clubId,
        kind: 'family_digest',
        dedupeKey: `family_digest:${link.id}:${weekStart}`,
        to: guardian.email,
        ...mail,
        // RFC 8058 §3.1: an HTTPS URI in List-Unsubscribe plus List-Unsubscribe-Post: List-Unsubscribe=One-Click.
        headers: { 'List-Unsubscribe': `<${oneClick}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' },
        attachments: [
          {
            filename: 'week.png',
            cid: chartCid,
            contentType: 'image/png',
            contentBase64: barChartPng(weeks.map((w) => w.hitRate)).toString('base64'),
          },
        ],
      });
      if (queued) sent++;
      else skipped++;
    }
    return { sent, skipped };
  }

  private weeklyFigures(playerId: string, from: string, to: string): { weekStart: string; reps: number; hitRate: number | null }[] {
    const rows = this.db.$client
      .prepare(
        `SELECT date(recorded_at, 'weekday 0', '-6 days') AS w, COUNT(*) AS reps, AVG(outcome = 'on_target') AS rate
           FROM kicks WHERE player_id = ? AND deleted_at IS NULL AND recorded_at >= ? AND recorded_at < ? GROUP BY w`,
      )
      .all(playerId, from, to) as { w: string; reps: number; rate: number }[];
    const out: { weekStart: string; reps: number; hitRate: number | null }[] = [];
    for (let d = from; d < to; d = addDays(d, 7)) {
      const r = rows.find((x) => x.w === d);
      out.push({ weekStart: d, reps: r?.reps ?? 0, hitRate: r ? r.rate : null });
    }
    return out;
  }

  private highlight(playerId: string, from: string, to: string, f: QuantityFormat): string | null {
    const longest = this.db.$client
      .prepare(
        `SELECT technique, MAX(carry_m) AS carry FROM kicks WHERE player_id = ? AND deleted_at IS NULL AND outcome = 'on_target' AND carry_m IS NOT NULL AND recorded_at >= ? AND recorded_at < ?`,
      )
      .get(playerId, from, to) as { technique: string | null; carry: number | null };
    if (longest.carry !== null && longest.technique) return `Longest ${longest.technique} kick on target: ${f.distance(longest.carry)}`;
    const best = this.db.$client
      .prepare(
        `SELECT technique, COUNT(*) AS n, AVG(outcome = 'on_target') AS rate FROM kicks WHERE player_id = ? AND deleted_at IS NULL AND recorded_at >= ? AND recorded_at < ? GROUP BY technique HAVING n >= 5 ORDER BY rate DESC LIMIT 1`,
      )
      .get(playerId, from, to) as { technique: string; n: number; rate: number } | undefined;
    return best ? `Most accurate with ${best.technique} kicks (${f.percent(best.rate)} on target)` : null;
  }

  private queueSquadWeek(clubId: string, weekStart: string): number {
    const weekEnd = addDays(weekStart, 7);
    const coaches = this.db
      .select()
      .from(users)
      .where(and(eq(users.clubId, clubId), eq(users.role, 'head_coach')))
      .all()
      .filter((u) => !u.disabledAt);
    const club = this.db.select().from(clubs).where(eq(clubs.id, clubId)).get();
    const limit = club?.repLimitPerSession ?? DEFAULT_REP_LIMIT_PER_SESSION;
    const f = clubFormat(this.db, clubId);
    let sent = 0;
    for (const coach of coaches) {
      const squadIds = this.db
        .select({ id: squadStaff.squadId })
        .from(squadStaff)
        .where(eq(squadStaff.userId, coach.id))
        .all()
        .map((r) => r.id);
      if (!squadIds.length) continue;
      const named = this.db.select().from(squads).where(inArray(squads.id, squadIds)).all();
      const lines = named.map((s) => {
        const agg = this.db.$client
          .prepare(
            `SELECT COUNT(*) AS reps, AVG(k.outcome = 'on_target') AS rate FROM training_sessions t JOIN kicks k ON k.session_id = t.id
              WHERE t.squad_id = ? AND t.started_at >= ? AND t.started_at < ? AND k.deleted_at IS NULL AND t.deleted_at IS NULL`,
          )
          .get(s.id, weekStart, weekEnd) as { reps: number; rate: number | null };
        const flags = this.db.$client
          .prepare(
            `SELECT COUNT(*) AS n FROM (SELECT k.player_id FROM training_sessions t JOIN kicks k ON k.session_id = t.id
              WHERE t.squad_id = ? AND t.started_at >= ? AND t.started_at < ? AND k.deleted_at IS NULL GROUP BY t.id, k.player_id HAVING COUNT(*) > ?)`,
          )
          .get(s.id, weekStart, weekEnd, limit) as { n: number };
        return { squadName: s.name, reps: agg.reps, hitRate: agg.rate === null ? null : f.percent(agg.rate), loadFlags: flags.n };
      });
      const mail = squadWeekMail({
        coachName: coach.displayName,
        weekLabel: f.day(weekStart, true),
        lines,
        link: `${this.config.publicUrl}/squad-week?start=${weekStart}`,
      });
      if (this.mailer.queue({ clubId, kind: 'squad_week', dedupeKey: `squad_week:${coach.id}:${weekStart}`, to: coach.email, ...mail }))
        sent++;
    }
    return sent;
  }
}

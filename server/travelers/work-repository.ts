import { and, asc, desc, eq, inArray, isNotNull, isNull, or, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db';
import { travelers, users, workPhotos, workSessions } from '../../db/schema';
import type { HoursByWho, StepPerformer, WorkSession } from '../../db/contracts';
import { visibleBuilds } from '../builds/build-access';
import { joinTravelerPart } from './travelers-repository';

/** How many of a part's sessions its page lists; the sums count them all. */
export const RECENT_SESSIONS = 20;

type SessionRow = {
  id: string;
  personName: string;
  by: StepPerformer;
  byName: string | null;
  startedAt: Date;
  endedAt: Date | null;
  entered: boolean;
};
const asSession = (r: SessionRow): WorkSession => ({
  ...r,
  startedAt: r.startedAt.toISOString(),
  endedAt: r.endedAt?.toISOString() ?? null,
});

/** The person's running session on the part, if any (under the part's lock when writing). */
export async function findRunningSession(db: Db, travelerId: string, personId: string) {
  const [row] = await db
    .select({
      id: workSessions.id,
      startedAt: workSessions.startedAt,
      by: workSessions.performer,
      byName: workSessions.performerName,
    })
    .from(workSessions)
    .where(
      and(eq(workSessions.travelerId, travelerId), eq(workSessions.personId, personId), isNull(workSessions.endedAt)),
    );
  return row ?? null;
}

export async function insertSession(db: Db, values: typeof workSessions.$inferInsert) {
  const [row] = await db.insert(workSessions).values(values).returning({ id: workSessions.id });
  return row.id;
}

export async function endSession(db: Db, id: string, endedAt: Date) {
  await db.update(workSessions).set({ endedAt }).where(eq(workSessions.id, id));
}

/** Hours of finished sessions, grouped by who did the work: the person, or the help they named; most first. */
async function sumByWho(db: Db, where: SQL): Promise<HoursByWho[]> {
  const who = sql<string>`coalesce(${workSessions.performerName}, ${users.name})`;
  const hours = sql<number>`round((sum(extract(epoch from ${workSessions.endedAt} - ${workSessions.startedAt})) / 3600)::numeric, 2)::float8`;
  return db
    .select({ who, by: workSessions.performer, hours })
    .from(workSessions)
    .innerJoin(users, eq(users.id, workSessions.personId))
    .where(and(where, isNotNull(workSessions.endedAt)))
    .groupBy(who, workSessions.performer)
    .orderBy(desc(hours), who);
}

/**
 * A part's time worked, in one statement (the part's page reads it on every load): the reader's running
 * session, the latest sessions and the hours of finished ones by who did the work (the person, or the
 * help they named), most first.
 */
export async function readPartWork(db: Db, travelerId: string, personId: string) {
  const session = sql.raw(`ws.id, u.name as "personName", ws.performer as "by", ws.performer_name as "byName",
    ws.started_at as "startedAt", ws.ended_at as "endedAt", ws.entered`);
  const res = await db.execute(sql`select
    (select coalesce(json_agg(r), '[]'::json) from (select ${session} from work_sessions ws
      join users u on u.id = ws.person_id where ws.traveler_id = ${travelerId}
      order by ws.started_at desc, ws.id desc limit ${RECENT_SESSIONS}) r) as recent,
    (select coalesce(json_agg(w), '[]'::json) from (select coalesce(ws.performer_name, u.name) as who, ws.performer as "by",
      round((sum(extract(epoch from ws.ended_at - ws.started_at)) / 3600)::numeric, 2)::float8 as hours
      from work_sessions ws join users u on u.id = ws.person_id
      where ws.traveler_id = ${travelerId} and ws.ended_at is not null
      group by 1, 2 order by hours desc, who) w) as "byWho",
    (select row_to_json(m) from (select ${session} from work_sessions ws join users u on u.id = ws.person_id
      where ws.traveler_id = ${travelerId} and ws.person_id = ${personId} and ws.ended_at is null limit 1) m) as running`);
  type JsonSession = Omit<SessionRow, 'startedAt' | 'endedAt'> & { startedAt: string; endedAt: string | null };
  const row = res.rows[0] as { recent: JsonSession[]; byWho: HoursByWho[]; running: JsonSession | null };
  // JSON carries PostgreSQL's own timestamp text: read back as dates, written as the API's ISO strings.
  const fromJson = (r: JsonSession) =>
    asSession({ ...r, startedAt: new Date(r.startedAt), endedAt: r.endedAt ? new Date(r.endedAt) : null });
  return {
    running: row.running ? fromJson(row.running) : null,
    recent: row.recent.map(fromJson),
    byWho: row.byWho,
    totalHours: Math.round(row.byWho.reduce((n, r) => n + r.hours, 0) * 100) / 100,
  };
}

/** The build's hours by who, over every part (replaced ones too: the time was worked); only when visible. */
export async function readBuildHours(db: Db, user: Express.User, buildId: string): Promise<HoursByWho[]> {
  const visibleParts = joinTravelerPart(db.select({ id: travelers.id }).from(travelers).$dynamic()).where(
    and(eq(travelers.buildId, buildId), visibleBuilds(db, user)),
  );
  return sumByWho(db, inArray(workSessions.travelerId, visibleParts));
}

export async function insertWorkPhotos(tx: Db, values: (typeof workPhotos.$inferInsert)[]) {
  if (values.length) await tx.insert(workPhotos).values(values);
}

/** A work photo's part and storage keys (the photo route checks the reader still sees the part). */
export async function findWorkPhotoRow(db: Db, id: string) {
  const [row] = await db
    .select({ travelerId: workPhotos.travelerId, fileKey: workPhotos.fileKey, thumbKey: workPhotos.thumbKey })
    .from(workPhotos)
    .where(eq(workPhotos.id, id));
  return row ?? null;
}

/** The work photos of these bench events, oldest first, only where the part's build is visible. */
export async function listWorkPhotosOfEvents(db: Db, user: Express.User, eventIds: string[]) {
  if (eventIds.length === 0) return [];
  return joinTravelerPart(
    db
      .select({ id: workPhotos.id, eventId: workPhotos.eventId, thumbKey: workPhotos.thumbKey })
      .from(workPhotos)
      .innerJoin(travelers, eq(travelers.id, workPhotos.travelerId))
      .$dynamic(),
  )
    .where(and(inArray(workPhotos.eventId, eventIds), visibleBuilds(db, user)))
    .orderBy(asc(workPhotos.createdAt), asc(workPhotos.id));
}

/** Of these storage keys, those a work photo points to (the photo sweep keeps them). */
export async function workPhotoKeysInUse(db: Db, keys: string[]): Promise<Set<string>> {
  const rows = await db
    .select({ fileKey: workPhotos.fileKey, thumbKey: workPhotos.thumbKey })
    .from(workPhotos)
    .where(or(inArray(workPhotos.fileKey, keys), inArray(workPhotos.thumbKey, keys)));
  return new Set(rows.flatMap((r) => [r.fileKey, r.thumbKey]));
}

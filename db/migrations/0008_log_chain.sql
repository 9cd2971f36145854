-- The build log's hash chain (table log_chain, made in 0007), kept by the database itself: every insert
-- into an event table appends a link, in one place whatever code path wrote the event, and an event row
-- is never edited or deleted by hand (a correction is a new entry). server/build-log/README.md
-- ("Hash chain") documents the canonical text and the hash, which outside checkers recompute.

-- A timestamp as UTC text to the microsecond, whatever the session's time zone: 2026-12-03T12:17:36.000123Z.
CREATE FUNCTION log_time_text(t timestamptz) RETURNS text
  LANGUAGE sql STABLE STRICT
  AS $$ SELECT to_char(t AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"') $$;
--> statement-breakpoint

-- The canonical text of an event: its source letter, then every stored column in table order, nulls as
-- empty fields, jsonb as its ::text, joined by chr(31) (unit separator). One function per event table,
-- the only definition: the insert trigger and log_chain_check both call it.
-- A column added to an event table later must leave the text of the rows already stored unchanged.
CREATE FUNCTION log_entry_text(e build_events) RETURNS text
  LANGUAGE sql STABLE
  AS $$ SELECT array_to_string(ARRAY[
    'b', e.id::text, e.build_id::text, e.actor_id::text, e.kind, e.detail::text,
    log_time_text(e.created_at), log_time_text(e.done_at), e.clock_offset_ms::text
  ], chr(31), '') $$;
--> statement-breakpoint
CREATE FUNCTION log_entry_text(e traveler_events) RETURNS text
  LANGUAGE sql STABLE
  AS $$ SELECT array_to_string(ARRAY[
    't', e.id::text, e.traveler_id::text, e.actor_id::text, e.kind, e.detail::text,
    log_time_text(e.created_at), log_time_text(e.done_at), e.clock_offset_ms::text
  ], chr(31), '') $$;
--> statement-breakpoint
CREATE FUNCTION log_entry_text(e finding_events) RETURNS text
  LANGUAGE sql STABLE
  AS $$ SELECT array_to_string(ARRAY[
    'f', e.id::text, e.finding_id::text, e.actor_id::text, e.action::text, e.actor_place::text,
    e.from_status::text, e.to_status::text, e.disposition::text, e.note, log_time_text(e.created_at)
  ], chr(31), '') $$;
--> statement-breakpoint

-- A link's hash: lower-case hex SHA-256 of the previous link's hash ('' for the first), chr(30)
-- (record separator) and the event's canonical text, as UTF-8.
CREATE FUNCTION log_link_hash(prev text, entry text) RETURNS text
  LANGUAGE sql IMMUTABLE
  AS $$ SELECT encode(sha256(convert_to(coalesce(prev, '') || chr(30) || entry, 'UTF8')), 'hex') $$;
--> statement-breakpoint

-- Appends the new event's link to its build's chain. The transaction-scoped advisory lock (two-key form,
-- apart from the single-key locks elsewhere) serialises the writers of one build until they commit, so
-- each reads the last link its predecessor wrote: seq stays 1..n without gaps or twins.
CREATE FUNCTION log_chain_append() RETURNS trigger
  LANGUAGE plpgsql
  AS $$
DECLARE
  b uuid;
  src text;
  entry text;
  last_seq integer;
  last_hash text;
BEGIN
  IF TG_TABLE_NAME = 'build_events' THEN
    src := 'b';
    b := NEW.build_id;
  ELSIF TG_TABLE_NAME = 'traveler_events' THEN
    src := 't';
    SELECT tr.build_id INTO b FROM travelers tr WHERE tr.id = NEW.traveler_id;
  ELSE
    src := 'f';
    SELECT tr.build_id INTO b FROM findings f JOIN travelers tr ON tr.id = f.traveler_id WHERE f.id = NEW.finding_id;
  END IF;
  entry := log_entry_text(NEW);
  PERFORM pg_advisory_xact_lock(hashtext('log_chain'), hashtext(b::text));
  SELECT c.seq, c.hash INTO last_seq, last_hash FROM log_chain c WHERE c.build_id = b ORDER BY c.seq DESC LIMIT 1;
  INSERT INTO log_chain (build_id, seq, source, event_id, hash)
    VALUES (b, coalesce(last_seq, 0) + 1, src, NEW.id, log_link_hash(coalesce(last_hash, ''), entry));
  RETURN NULL;
END $$;
--> statement-breakpoint

CREATE FUNCTION log_event_refuse_update() RETURNS trigger
  LANGUAGE plpgsql
  AS $$
BEGIN
  RAISE EXCEPTION 'log entries are never edited: a correction is a new entry (% %)', TG_TABLE_NAME, OLD.id
    USING HINT = 'write a new event that corrects this one';
END $$;
--> statement-breakpoint

-- A delete is refused unless it is the cascade of deleting the event's owner (the build, or the part or
-- finding under it): the foreign key's cascade deletes the events after the owner row, which is then
-- gone; a direct DELETE always finds its owner (the foreign key keeps it). Checked on the owner itself
-- rather than on pg_trigger_depth() (2 inside a cascade), which any other trigger's delete would pass too.
CREATE FUNCTION log_event_refuse_delete() RETURNS trigger
  LANGUAGE plpgsql
  AS $$
DECLARE
  owner_gone boolean;
BEGIN
  IF TG_TABLE_NAME = 'build_events' THEN
    owner_gone := NOT EXISTS (SELECT 1 FROM builds WHERE id = OLD.build_id);
  ELSIF TG_TABLE_NAME = 'traveler_events' THEN
    owner_gone := NOT EXISTS (SELECT 1 FROM travelers WHERE id = OLD.traveler_id);
  ELSE
    owner_gone := NOT EXISTS (SELECT 1 FROM findings WHERE id = OLD.finding_id);
  END IF;
  IF owner_gone THEN
    RETURN OLD;
  END IF;
  RAISE EXCEPTION 'log entries are never deleted or edited: a correction is a new entry (% %)', TG_TABLE_NAME, OLD.id
    USING HINT = 'write a new event that corrects this one';
END $$;
--> statement-breakpoint

-- The triggers first: creating them locks the tables against inserts until this migration commits, so
-- no event slips between the backfill below and the first trigger-written link.
CREATE TRIGGER build_events_chain AFTER INSERT ON build_events FOR EACH ROW EXECUTE FUNCTION log_chain_append();
--> statement-breakpoint
CREATE TRIGGER traveler_events_chain AFTER INSERT ON traveler_events FOR EACH ROW EXECUTE FUNCTION log_chain_append();
--> statement-breakpoint
CREATE TRIGGER finding_events_chain AFTER INSERT ON finding_events FOR EACH ROW EXECUTE FUNCTION log_chain_append();
--> statement-breakpoint
CREATE TRIGGER build_events_no_update BEFORE UPDATE ON build_events FOR EACH ROW EXECUTE FUNCTION log_event_refuse_update();
--> statement-breakpoint
CREATE TRIGGER traveler_events_no_update BEFORE UPDATE ON traveler_events FOR EACH ROW EXECUTE FUNCTION log_event_refuse_update();
--> statement-breakpoint
CREATE TRIGGER finding_events_no_update BEFORE UPDATE ON finding_events FOR EACH ROW EXECUTE FUNCTION log_event_refuse_update();
--> statement-breakpoint
CREATE TRIGGER build_events_no_delete BEFORE DELETE ON build_events FOR EACH ROW EXECUTE FUNCTION log_event_refuse_delete();
--> statement-breakpoint
CREATE TRIGGER traveler_events_no_delete BEFORE DELETE ON traveler_events FOR EACH ROW EXECUTE FUNCTION log_event_refuse_delete();
--> statement-breakpoint
CREATE TRIGGER finding_events_no_delete BEFORE DELETE ON finding_events FOR EACH ROW EXECUTE FUNCTION log_event_refuse_delete();
--> statement-breakpoint

-- Links for the events already stored: per build, in the order (created_at, source, id).
DO $$
DECLARE
  r record;
  cur uuid;
  n integer;
  prev text;
BEGIN
  FOR r IN
    SELECT x.build_id, x.source, x.id, x.entry
    FROM (
      SELECT e.build_id, 'b' AS source, e.id, e.created_at, log_entry_text(e) AS entry FROM build_events e
      UNION ALL
      SELECT tr.build_id, 't', e.id, e.created_at, log_entry_text(e)
        FROM traveler_events e JOIN travelers tr ON tr.id = e.traveler_id
      UNION ALL
      SELECT tr.build_id, 'f', e.id, e.created_at, log_entry_text(e)
        FROM finding_events e JOIN findings f ON f.id = e.finding_id JOIN travelers tr ON tr.id = f.traveler_id
    ) x
    ORDER BY x.build_id, x.created_at, x.source, x.id
  LOOP
    IF cur IS DISTINCT FROM r.build_id THEN
      cur := r.build_id;
      n := 0;
      prev := '';
    END IF;
    n := n + 1;
    prev := log_link_hash(prev, r.entry);
    INSERT INTO log_chain (build_id, seq, source, event_id, hash) VALUES (r.build_id, n, r.source, r.id, prev);
  END LOOP;
END $$;
--> statement-breakpoint

-- Where one build's stored chain and its events disagree, at most 50 rows, in chain order:
--   missing    the link's event no longer exists;
--   changed    the link's hash is not the hash of the STORED previous hash and the event's text as it is
--              now (recomputed from the stored previous hash, so one altered row names that row alone);
--   unchained  an event of the build has no link (seq is null).
CREATE FUNCTION log_chain_check(build uuid)
  RETURNS TABLE (seq integer, source text, event_id uuid, problem text)
  LANGUAGE sql STABLE
  AS $$
  WITH links AS (
    SELECT c.seq, c.source, c.event_id, c.hash,
      coalesce(lag(c.hash) OVER (ORDER BY c.seq), '') AS prev,
      CASE
        WHEN be.id IS NOT NULL THEN log_entry_text(be)
        WHEN te.id IS NOT NULL THEN log_entry_text(te)
        WHEN fe.id IS NOT NULL THEN log_entry_text(fe)
      END AS entry
    FROM log_chain c
      LEFT JOIN build_events be ON c.source = 'b' AND be.id = c.event_id
      LEFT JOIN traveler_events te ON c.source = 't' AND te.id = c.event_id
      LEFT JOIN finding_events fe ON c.source = 'f' AND fe.id = c.event_id
    WHERE c.build_id = build
  ),
  events AS (
    SELECT 'b' AS source, e.id FROM build_events e WHERE e.build_id = build
    UNION ALL
    SELECT 't', e.id FROM traveler_events e JOIN travelers tr ON tr.id = e.traveler_id WHERE tr.build_id = build
    UNION ALL
    SELECT 'f', e.id FROM finding_events e
      JOIN findings f ON f.id = e.finding_id JOIN travelers tr ON tr.id = f.traveler_id
      WHERE tr.build_id = build
  ),
  breaks AS (
    SELECT l.seq, l.source, l.event_id, CASE WHEN l.entry IS NULL THEN 'missing' ELSE 'changed' END AS problem
    FROM links l
    WHERE l.entry IS NULL OR log_link_hash(l.prev, l.entry) <> l.hash
    UNION ALL
    SELECT NULL::integer, x.source, x.id, 'unchained'
    FROM events x
    WHERE NOT EXISTS (SELECT 1 FROM log_chain c WHERE c.source = x.source AND c.event_id = x.id)
  )
  SELECT b.seq, b.source, b.event_id, b.problem FROM breaks b ORDER BY b.seq NULLS LAST, b.source, b.event_id LIMIT 50
$$;

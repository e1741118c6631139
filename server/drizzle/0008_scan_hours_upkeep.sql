-- Upkeep of scan_hours (distinct scans per local hour and day, per counted source), so the outlook
-- reads a few rows per day instead of every scan. Statement triggers on scans recount the local days
-- a statement touched, inside that statement's transaction: nothing is ever counted half-way, and
-- every write path (intake, demo loader, scripts) is covered without remembering to call anything.

-- The local day (days since 1970-01-01) of an instant at a site's UTC offset.
CREATE FUNCTION scan_local_day(t timestamptz, offset_minutes integer) RETURNS integer
LANGUAGE sql IMMUTABLE AS $$
  SELECT floor((extract(epoch FROM t) + offset_minutes * 60) / 86400)::integer
$$;
--> statement-breakpoint

-- Counts the given local days of one site again from its scans. Which scans each counted source is
-- judged against follows the onset rules: a cell table with the scan inventory (a time both give is one
-- scan), a volume or column-maximum run with its own scans. The scans are read over the span from the
-- first to the last day (one index range on scans_site_time_idx), then kept to the days asked for.
CREATE FUNCTION scan_hours_recount(p_site integer, p_days integer[]) RETURNS void
LANGUAGE sql AS $$
  DELETE FROM scan_hours WHERE site_id = p_site AND local_day = ANY (p_days);
  WITH site AS (
    SELECT utc_offset_minutes * 60 AS shift,
           (SELECT min(d) FROM unnest(p_days) AS d) AS first_day,
           (SELECT max(d) FROM unnest(p_days) AS d) AS last_day
    FROM radar_sites WHERE id = p_site
  ), members (counted, source) AS (
    VALUES ('cell-table', 'scan-inventory'), ('cell-table', 'cell-table'), ('volume', 'volume'),
           ('column-max', 'column-max')
  ), seen AS (
    SELECT DISTINCT m.counted, s.time, extract(epoch FROM s.time) + site.shift AS local_s
    FROM scans s JOIN members m ON m.source = s.source CROSS JOIN site
    WHERE s.site_id = p_site
      AND s.time >= to_timestamp(site.first_day::float8 * 86400 - site.shift)
      AND s.time < to_timestamp((site.last_day + 1)::float8 * 86400 - site.shift)
  ), per_hour AS (
    SELECT counted, floor(local_s / 86400)::integer AS local_day,
           floor((local_s - floor(local_s / 86400) * 86400) / 3600)::integer AS hour, count(*)::integer AS n
    FROM seen GROUP BY 1, 2, 3
  )
  INSERT INTO scan_hours (site_id, source, local_day, scans)
  SELECT p_site, d.counted, d.local_day, array_agg(coalesce(p.n, 0) ORDER BY h.hour)
  FROM (SELECT DISTINCT counted, local_day FROM per_hour WHERE local_day = ANY (p_days)) AS d
  CROSS JOIN generate_series(0, 23) AS h(hour)
  LEFT JOIN per_hour p ON p.counted = d.counted AND p.local_day = d.local_day AND p.hour = h.hour
  GROUP BY d.counted, d.local_day;
$$;
--> statement-breakpoint

CREATE FUNCTION scan_hours_after_scans_change() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP IN ('INSERT', 'UPDATE') THEN
    PERFORM scan_hours_recount(c.site_id, c.days)
    FROM (SELECT n.site_id, array_agg(DISTINCT scan_local_day(n.time, r.utc_offset_minutes)) AS days
          FROM new_rows n JOIN radar_sites r ON r.id = n.site_id GROUP BY n.site_id) AS c;
  END IF;
  IF TG_OP IN ('DELETE', 'UPDATE') THEN
    PERFORM scan_hours_recount(c.site_id, c.days)
    FROM (SELECT o.site_id, array_agg(DISTINCT scan_local_day(o.time, r.utc_offset_minutes)) AS days
          FROM old_rows o JOIN radar_sites r ON r.id = o.site_id GROUP BY o.site_id) AS c;
  END IF;
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER scan_hours_after_insert AFTER INSERT ON scans REFERENCING NEW TABLE AS new_rows
FOR EACH STATEMENT EXECUTE FUNCTION scan_hours_after_scans_change();
--> statement-breakpoint
CREATE TRIGGER scan_hours_after_delete AFTER DELETE ON scans REFERENCING OLD TABLE AS old_rows
FOR EACH STATEMENT EXECUTE FUNCTION scan_hours_after_scans_change();
--> statement-breakpoint
CREATE TRIGGER scan_hours_after_update AFTER UPDATE ON scans REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows
FOR EACH STATEMENT EXECUTE FUNCTION scan_hours_after_scans_change();
--> statement-breakpoint

CREATE FUNCTION scan_hours_after_truncate() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  DELETE FROM scan_hours;
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER scan_hours_after_truncate AFTER TRUNCATE ON scans
FOR EACH STATEMENT EXECUTE FUNCTION scan_hours_after_truncate();
--> statement-breakpoint

-- A site's local days move with its UTC offset: count the whole site again.
CREATE FUNCTION scan_hours_after_offset_change() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
  DELETE FROM scan_hours WHERE site_id = NEW.id;
  PERFORM scan_hours_recount(NEW.id, (SELECT array_agg(DISTINCT scan_local_day(s.time, NEW.utc_offset_minutes))
                                      FROM scans s WHERE s.site_id = NEW.id));
  RETURN NULL;
END
$$;
--> statement-breakpoint
CREATE TRIGGER scan_hours_after_offset_change AFTER UPDATE OF utc_offset_minutes ON radar_sites
FOR EACH ROW WHEN (OLD.utc_offset_minutes IS DISTINCT FROM NEW.utc_offset_minutes)
EXECUTE FUNCTION scan_hours_after_offset_change();
--> statement-breakpoint

-- Scans stored before this migration.
SELECT scan_hours_recount(r.id, (SELECT array_agg(DISTINCT scan_local_day(s.time, r.utc_offset_minutes))
                                 FROM scans s WHERE s.site_id = r.id))
FROM radar_sites r;

-- Custom SQL migration file, put your code below! ---- The map summaries follow take_notes: a statement adds (or, on delete, takes away) each
-- take's notes, grouped, in the same transaction. Rows are upserted in key order so two
-- takes stored at once by one player lock them in the same order.
CREATE FUNCTION take_notes_add_to_maps() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  INSERT INTO map_key_days AS s (player_id, day, instrument, pattern, pair, key, notes, errors)
  SELECT player_id, (played_at AT TIME ZONE 'UTC')::date, instrument, pattern, pair, key,
         count(*), count(*) FILTER (WHERE verdict <> 'hit')
  FROM new_notes GROUP BY 1, 2, 3, 4, 5, 6 ORDER BY 1, 2, 3, 4, 5, 6
  ON CONFLICT (player_id, day, instrument, pattern, pair, key)
  DO UPDATE SET notes = s.notes + EXCLUDED.notes, errors = s.errors + EXCLUDED.errors;

  INSERT INTO map_range_days AS s (player_id, day, instrument, pattern, pair, midi, notes, errors)
  SELECT player_id, (played_at AT TIME ZONE 'UTC')::date, instrument, pattern, pair, midi,
         count(*), count(*) FILTER (WHERE verdict <> 'hit')
  FROM new_notes GROUP BY 1, 2, 3, 4, 5, 6 ORDER BY 1, 2, 3, 4, 5, 6
  ON CONFLICT (player_id, day, instrument, pattern, pair, midi)
  DO UPDATE SET notes = s.notes + EXCLUDED.notes, errors = s.errors + EXCLUDED.errors;

  INSERT INTO map_beat_days AS s (player_id, day, instrument, pattern, pair, meter, position, notes, errors)
  SELECT player_id, (played_at AT TIME ZONE 'UTC')::date, instrument, pattern, pair, meter, position,
         count(*), count(*) FILTER (WHERE verdict <> 'hit')
  FROM new_notes GROUP BY 1, 2, 3, 4, 5, 6, 7 ORDER BY 1, 2, 3, 4, 5, 6, 7
  ON CONFLICT (player_id, day, instrument, pattern, pair, meter, position)
  DO UPDATE SET notes = s.notes + EXCLUDED.notes, errors = s.errors + EXCLUDED.errors;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE FUNCTION take_notes_remove_from_maps() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE map_key_days s SET notes = s.notes - d.notes, errors = s.errors - d.errors
  FROM (SELECT player_id, (played_at AT TIME ZONE 'UTC')::date AS day, instrument, pattern, pair, key,
               count(*) AS notes, count(*) FILTER (WHERE verdict <> 'hit') AS errors
        FROM old_notes GROUP BY 1, 2, 3, 4, 5, 6) d
  WHERE s.player_id = d.player_id AND s.day = d.day AND s.instrument = d.instrument
    AND s.pattern = d.pattern AND s.pair = d.pair AND s.key = d.key;

  UPDATE map_range_days s SET notes = s.notes - d.notes, errors = s.errors - d.errors
  FROM (SELECT player_id, (played_at AT TIME ZONE 'UTC')::date AS day, instrument, pattern, pair, midi,
               count(*) AS notes, count(*) FILTER (WHERE verdict <> 'hit') AS errors
        FROM old_notes GROUP BY 1, 2, 3, 4, 5, 6) d
  WHERE s.player_id = d.player_id AND s.day = d.day AND s.instrument = d.instrument
    AND s.pattern = d.pattern AND s.pair = d.pair AND s.midi = d.midi;

  UPDATE map_beat_days s SET notes = s.notes - d.notes, errors = s.errors - d.errors
  FROM (SELECT player_id, (played_at AT TIME ZONE 'UTC')::date AS day, instrument, pattern, pair, meter, position,
               count(*) AS notes, count(*) FILTER (WHERE verdict <> 'hit') AS errors
        FROM old_notes GROUP BY 1, 2, 3, 4, 5, 6, 7) d
  WHERE s.player_id = d.player_id AND s.day = d.day AND s.instrument = d.instrument
    AND s.pattern = d.pattern AND s.pair = d.pair AND s.meter = d.meter AND s.position = d.position;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER take_notes_add_to_maps AFTER INSERT ON take_notes
  REFERENCING NEW TABLE AS new_notes FOR EACH STATEMENT EXECUTE FUNCTION take_notes_add_to_maps();
--> statement-breakpoint
CREATE TRIGGER take_notes_remove_from_maps AFTER DELETE ON take_notes
  REFERENCING OLD TABLE AS old_notes FOR EACH STATEMENT EXECUTE FUNCTION take_notes_remove_from_maps();
--> statement-breakpoint
-- Notes stored before the summaries existed.
INSERT INTO map_key_days (player_id, day, instrument, pattern, pair, key, notes, errors)
SELECT player_id, (played_at AT TIME ZONE 'UTC')::date, instrument, pattern, pair, key,
       count(*), count(*) FILTER (WHERE verdict <> 'hit')
FROM take_notes GROUP BY 1, 2, 3, 4, 5, 6;
--> statement-breakpoint
INSERT INTO map_range_days (player_id, day, instrument, pattern, pair, midi, notes, errors)
SELECT player_id, (played_at AT TIME ZONE 'UTC')::date, instrument, pattern, pair, midi,
       count(*), count(*) FILTER (WHERE verdict <> 'hit')
FROM take_notes GROUP BY 1, 2, 3, 4, 5, 6;
--> statement-breakpoint
INSERT INTO map_beat_days (player_id, day, instrument, pattern, pair, meter, position, notes, errors)
SELECT player_id, (played_at AT TIME ZONE 'UTC')::date, instrument, pattern, pair, meter, position,
       count(*), count(*) FILTER (WHERE verdict <> 'hit')
FROM take_notes GROUP BY 1, 2, 3, 4, 5, 6, 7;
--> statement-breakpoint
UPDATE takes t SET duration_ms = GREATEST(
  COALESCE((SELECT max((e->>'timeMs')::real + COALESCE((e->>'durationMs')::real, 0)) FROM jsonb_array_elements(t.played) e), 0),
  COALESCE((SELECT max(n.beat) FROM take_notes n WHERE n.take_id = t.id) * 60000 / t.tempo, 0))
WHERE duration_ms IS NULL;

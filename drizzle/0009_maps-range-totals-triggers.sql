-- Custom SQL migration file, put your code below! ---- The all-time range totals follow take_notes like the daily summaries (see maps-summary-triggers).
CREATE FUNCTION take_notes_add_to_range_totals() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  INSERT INTO map_range_totals AS s (player_id, instrument, pattern, pair, midi, notes, errors)
  SELECT player_id, instrument, pattern, pair, midi, count(*), count(*) FILTER (WHERE verdict <> 'hit')
  FROM new_notes GROUP BY 1, 2, 3, 4, 5 ORDER BY 1, 2, 3, 4, 5
  ON CONFLICT (player_id, instrument, pattern, pair, midi)
  DO UPDATE SET notes = s.notes + EXCLUDED.notes, errors = s.errors + EXCLUDED.errors;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE FUNCTION take_notes_remove_from_range_totals() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE map_range_totals s SET notes = s.notes - d.notes, errors = s.errors - d.errors
  FROM (SELECT player_id, instrument, pattern, pair, midi, count(*) AS notes, count(*) FILTER (WHERE verdict <> 'hit') AS errors
        FROM old_notes GROUP BY 1, 2, 3, 4, 5) d
  WHERE s.player_id = d.player_id AND s.instrument = d.instrument AND s.pattern = d.pattern
    AND s.pair = d.pair AND s.midi = d.midi;
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE TRIGGER take_notes_add_to_range_totals AFTER INSERT ON take_notes
  REFERENCING NEW TABLE AS new_notes FOR EACH STATEMENT EXECUTE FUNCTION take_notes_add_to_range_totals();
--> statement-breakpoint
CREATE TRIGGER take_notes_remove_from_range_totals AFTER DELETE ON take_notes
  REFERENCING OLD TABLE AS old_notes FOR EACH STATEMENT EXECUTE FUNCTION take_notes_remove_from_range_totals();
--> statement-breakpoint
INSERT INTO map_range_totals (player_id, instrument, pattern, pair, midi, notes, errors)
SELECT player_id, instrument, pattern, pair, midi, count(*), count(*) FILTER (WHERE verdict <> 'hit')
FROM take_notes GROUP BY 1, 2, 3, 4, 5;

CREATE TABLE "map_range_totals" (
	"player_id" uuid NOT NULL,
	"instrument" text NOT NULL,
	"pattern" text NOT NULL,
	"pair" text NOT NULL,
	"midi" smallint NOT NULL,
	"notes" integer NOT NULL,
	"errors" integer NOT NULL,
	CONSTRAINT "map_range_totals_player_id_instrument_pattern_pair_midi_pk" PRIMARY KEY("player_id","instrument","pattern","pair","midi")
);
--> statement-breakpoint
ALTER TABLE "map_range_totals" ADD CONSTRAINT "map_range_totals_player_id_users_id_fk" FOREIGN KEY ("player_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;
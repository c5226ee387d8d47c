CREATE TABLE "map_beat_days" (
	"player_id" uuid NOT NULL,
	"day" date NOT NULL,
	"instrument" text NOT NULL,
	"pattern" text NOT NULL,
	"pair" text NOT NULL,
	"meter" text NOT NULL,
	"position" real NOT NULL,
	"notes" integer NOT NULL,
	"errors" integer NOT NULL,
	CONSTRAINT "map_beat_days_player_id_day_instrument_pattern_pair_meter_position_pk" PRIMARY KEY("player_id","day","instrument","pattern","pair","meter","position")
);
--> statement-breakpoint
CREATE TABLE "map_key_days" (
	"player_id" uuid NOT NULL,
	"day" date NOT NULL,
	"instrument" text NOT NULL,
	"pattern" text NOT NULL,
	"pair" text NOT NULL,
	"key" text NOT NULL,
	"notes" integer NOT NULL,
	"errors" integer NOT NULL,
	CONSTRAINT "map_key_days_player_id_day_instrument_pattern_pair_key_pk" PRIMARY KEY("player_id","day","instrument","pattern","pair","key")
);
--> statement-breakpoint
CREATE TABLE "map_range_days" (
	"player_id" uuid NOT NULL,
	"day" date NOT NULL,
	"instrument" text NOT NULL,
	"pattern" text NOT NULL,
	"pair" text NOT NULL,
	"midi" smallint NOT NULL,
	"notes" integer NOT NULL,
	"errors" integer NOT NULL,
	CONSTRAINT "map_range_days_player_id_day_instrument_pattern_pair_midi_pk" PRIMARY KEY("player_id","day","instrument","pattern","pair","midi")
);
--> statement-breakpoint
ALTER TABLE "takes" ADD COLUMN "duration_ms" real;--> statement-breakpoint
ALTER TABLE "map_beat_days" ADD CONSTRAINT "map_beat_days_player_id_users_id_fk" FOREIGN KEY ("player_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "map_key_days" ADD CONSTRAINT "map_key_days_player_id_users_id_fk" FOREIGN KEY ("player_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "map_range_days" ADD CONSTRAINT "map_range_days_player_id_users_id_fk" FOREIGN KEY ("player_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "map_key_days_player_key_idx" ON "map_key_days" USING btree ("player_id","key","pattern");
CREATE TABLE "player_settings" (
	"user_id" uuid PRIMARY KEY NOT NULL,
	"instrument" text DEFAULT 'piano' NOT NULL,
	"written_pitch_input" boolean DEFAULT false NOT NULL,
	"octave_shift" smallint DEFAULT 0 NOT NULL,
	"range_low" smallint,
	"range_high" smallint,
	"default_tempo" real DEFAULT 100 NOT NULL,
	"latency" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "tempo_climbs" (
	"player_id" uuid NOT NULL,
	"drill" text NOT NULL,
	"key" text NOT NULL,
	"tempo" real NOT NULL,
	"last_tempo" real NOT NULL,
	"last_verdict" text NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "tempo_climbs_player_id_drill_key_pk" PRIMARY KEY("player_id","drill","key")
);
--> statement-breakpoint
ALTER TABLE "player_settings" ADD CONSTRAINT "player_settings_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tempo_climbs" ADD CONSTRAINT "tempo_climbs_player_id_users_id_fk" FOREIGN KEY ("player_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;
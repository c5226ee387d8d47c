CREATE TABLE "book_drills" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"book_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"saved_drill_id" uuid,
	"title" text NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"spec" jsonb NOT NULL,
	"key_cycle" text,
	"free" boolean DEFAULT false NOT NULL
);
--> statement-breakpoint
CREATE TABLE "books" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"teacher_id" uuid NOT NULL,
	"title" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"cover_colour" text DEFAULT 'brass' NOT NULL,
	"price_minor" integer DEFAULT 0 NOT NULL,
	"currency" text DEFAULT 'EUR' NOT NULL,
	"published" boolean DEFAULT false NOT NULL,
	"published_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "payment_events" (
	"id" text PRIMARY KEY NOT NULL,
	"type" text NOT NULL,
	"session_id" text,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "purchases" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"book_id" uuid NOT NULL,
	"player_id" uuid NOT NULL,
	"session_id" text NOT NULL,
	"payment_intent_id" text,
	"refund_id" text,
	"amount_minor" integer NOT NULL,
	"currency" text NOT NULL,
	"status" text DEFAULT 'pending' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"paid_at" timestamp with time zone,
	"refunded_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "book_drills" ADD CONSTRAINT "book_drills_book_id_books_id_fk" FOREIGN KEY ("book_id") REFERENCES "public"."books"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "book_drills" ADD CONSTRAINT "book_drills_saved_drill_id_saved_drills_id_fk" FOREIGN KEY ("saved_drill_id") REFERENCES "public"."saved_drills"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "books" ADD CONSTRAINT "books_teacher_id_users_id_fk" FOREIGN KEY ("teacher_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "purchases" ADD CONSTRAINT "purchases_book_id_books_id_fk" FOREIGN KEY ("book_id") REFERENCES "public"."books"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "purchases" ADD CONSTRAINT "purchases_player_id_users_id_fk" FOREIGN KEY ("player_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "book_drills_book_idx" ON "book_drills" USING btree ("book_id","position");--> statement-breakpoint
CREATE UNIQUE INDEX "book_drills_one_free_key" ON "book_drills" USING btree ("book_id") WHERE "book_drills"."free";--> statement-breakpoint
CREATE INDEX "books_teacher_idx" ON "books" USING btree ("teacher_id");--> statement-breakpoint
CREATE INDEX "books_published_idx" ON "books" USING btree ("published","published_at");--> statement-breakpoint
CREATE UNIQUE INDEX "purchases_session_key" ON "purchases" USING btree ("session_id");--> statement-breakpoint
CREATE UNIQUE INDEX "purchases_one_paid_key" ON "purchases" USING btree ("book_id","player_id") WHERE "purchases"."status" = 'paid';--> statement-breakpoint
CREATE INDEX "purchases_book_paid_idx" ON "purchases" USING btree ("book_id","paid_at");--> statement-breakpoint
CREATE INDEX "purchases_player_idx" ON "purchases" USING btree ("player_id");
ALTER TABLE "invitations" ADD COLUMN "name" text;--> statement-breakpoint
ALTER TABLE "invitations" ADD COLUMN "mail_id" uuid;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_mail_id_mail_outbox_id_fk" FOREIGN KEY ("mail_id") REFERENCES "public"."mail_outbox"("id") ON DELETE set null ON UPDATE no action;
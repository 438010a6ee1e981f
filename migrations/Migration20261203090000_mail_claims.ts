import { Migration } from '@mikro-orm/migrations';

/**
 * Mail delivery claims a message before sending it (status `sending` until `claimed_until`) and
 * keeps the Message-ID it was first sent with, so delivery holds no lock while SMTP talks and a
 * retry after a crash carries the same Message-ID.
 */
export class Migration20261203090000_mail_claims extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "mail_outbox" add column "message_id" varchar(255) null, add column "claimed_until" timestamptz null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`update "mail_outbox" set "status" = 'queued' where "status" = 'sending';`);
    this.addSql(`alter table "mail_outbox" drop column "message_id", drop column "claimed_until";`);
  }
}

import { Migration } from '@mikro-orm/migrations';

/**
 * Mail to homeowners goes out in the firm's name: the firm's own contact address (for Reply-To)
 * and, on each queued message, the display name it is sent under.
 */
export class Migration20261203100000_firm_contact extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "company" add column "contact_email" varchar(254) null;`);
    this.addSql(`alter table "mail_outbox" add column "from_name" varchar(120) null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "mail_outbox" drop column "from_name";`);
    this.addSql(`alter table "company" drop column "contact_email";`);
  }
}

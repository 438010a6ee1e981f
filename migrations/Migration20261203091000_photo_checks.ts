import { Migration } from '@mikro-orm/migrations';

/**
 * A photo check claims the photo (status `checking` until `checking_until`) in a short
 * transaction and does the storage reads and the image work outside any transaction.
 */
export class Migration20261203091000_photo_checks extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "lead_photo" add column "checking_until" timestamptz null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`update "lead_photo" set "status" = 'pending' where "status" = 'checking';`);
    this.addSql(`alter table "lead_photo" drop column "checking_until";`);
  }
}

import { Migration } from '@mikro-orm/migrations';

/**
 * Setup's firm profile and service area: the office's postal address, the logo's storage key, and a
 * service area given as a radius around the office's postcode.
 */
export class Migration20261204120000_firm_profile extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `alter table "company" add column "address_street" varchar(200) null, add column "address_city" varchar(100) null, add column "address_region" varchar(60) null, add column "address_postcode" varchar(12) null, add column "logo_key" varchar(200) null, add column "service_radius_miles" smallint null;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(
      `alter table "company" drop column "address_street", drop column "address_city", drop column "address_region", drop column "address_postcode", drop column "logo_key", drop column "service_radius_miles";`,
    );
  }
}

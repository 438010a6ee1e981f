import { Entity, Property, type Opt } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';

/**
 * An e-mail the firm sends homeowners from the inquiry page, with placeholders (`{name}`,
 * `{estimate_link}`, … see `~/lib/shared/mail-placeholders.ts`) filled in when it is sent. Every
 * firm starts with three (the database adds them when the firm is created; see the migration
 * `Migration20261203163000_inquiry_notes_mail`), and the owner edits them under Setup.
 */
@Entity({ tableName: 'mail_template' })
export class MailTemplate extends TenantEntity {
  @Property({ type: 'string', length: 80 })
  name!: string;

  @Property({ type: 'string', length: 200 })
  subject!: string;

  @Property({ type: 'text' })
  body!: string;

  /** Order in the pickers: lowest first. */
  @Property({ type: 'smallint' })
  position: number & Opt = 0;
}

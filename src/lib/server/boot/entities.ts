// Every entity class the ORM knows. Add a new entity here (and create a migration).
import { Company } from '../companies/company.entity';
import { FunnelEvent } from '../embed/funnel-event.entity';
import { Lead } from '../leads/lead.entity';
import { LeadEvent } from '../leads/lead-event.entity';
import { LeadViewKey } from '../leads/lead-view-key.entity';
import { MailTemplate } from '../leads/mail-template.entity';
import { LostReasonList } from '../leads/lost-reason-list.entity';
import { FollowUpReminder } from '../leads/follow-up-reminder.entity';
import { InquiryDigest } from '../leads/inquiry-digest.entity';
import { ListColumnChoice } from '../leads/list-column-choice.entity';
import { LeadPhoto } from '../photos/lead-photo.entity';
import { RateBookVersion } from '../rates/rate-book-version.entity';
import { OutboxMail } from '../mail/outbox-mail.entity';
import { Membership } from '../users/membership.entity';
import { User } from '../users/user.entity';
import { Session } from '../auth/session.entity';
import { PasswordReset } from '../auth/password-reset.entity';
import { Invite } from '../team/invite.entity';
import { RateLimitEntry } from '../db/rate-limit-entry.entity';
import { Availability } from '../visits/availability.entity';
import { Visit } from '../visits/visit.entity';
import { RateBookReplay } from '../rate-preview/rate-book-replay.entity';

export const entities = [
  Company,
  User,
  Membership,
  OutboxMail,
  RateBookVersion,
  Lead,
  LeadEvent,
  LeadViewKey,
  MailTemplate,
  LostReasonList,
  FollowUpReminder,
  ListColumnChoice,
  LeadPhoto,
  FunnelEvent,
  Session,
  PasswordReset,
  Invite,
  RateLimitEntry,
  InquiryDigest,
  Availability,
  Visit,
  RateBookReplay,
];

/**
 * Who gets the firm's e-mail about each new inquiry: every owner and salesperson, unless they have
 * opted out on their account page (`Membership.newInquiryMail`), and the further addresses the owner
 * lists in Setup → Notifications (`Company.notificationEmails`: a shared inbox, a bookkeeper).
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { STAFF_ROLES } from '~/lib/shared/labels';
import { Company } from '../companies/company.entity';
import { NotFound } from '../errors';
import { Membership } from '../users/membership.entity';

export async function newInquiryRecipients(em: EntityManager, companyId: string): Promise<string[]> {
  const [members, company] = await Promise.all([
    em.find(
      Membership,
      { company: companyId, newInquiryMail: true, role: { $in: [...STAFF_ROLES] } },
      { populate: ['user'], orderBy: { user: { email: 'asc' } } },
    ),
    em.findOneOrFail(Company, { id: companyId }),
  ]);
  // A member who turned the e-mail off is not sent it through the list either.
  const optedOut = new Set(
    (await em.find(Membership, { company: companyId, newInquiryMail: false }, { populate: ['user'] })).map((m) => m.user.email.toLowerCase()),
  );
  const extra = company.notificationEmails.filter((email) => !optedOut.has(email.toLowerCase()));
  return [...new Set([...members.map((m) => m.user.email), ...extra])];
}

/** Turns one person's new-inquiry e-mails on or off, in the firm they are working in. */
export async function setNewInquiryMail(
  em: EntityManager,
  input: { companyId: string; membershipId: string; on: boolean },
): Promise<{ newInquiryMail: boolean }> {
  const changed = await em.nativeUpdate(Membership, { id: input.membershipId, company: input.companyId }, { newInquiryMail: input.on });
  if (changed === 0) throw new NotFound();
  return { newInquiryMail: input.on };
}

export async function getNewInquiryMail(em: EntityManager, input: { companyId: string; membershipId: string }): Promise<boolean> {
  const membership = await em.findOne(Membership, { id: input.membershipId, company: input.companyId });
  if (!membership) throw new NotFound();
  return membership.newInquiryMail;
}

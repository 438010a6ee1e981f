/**
 * Who gets the firm's e-mail about each new inquiry: every owner and salesperson, unless they have
 * opted out on their account page (`Membership.newInquiryMail`).
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { STAFF_ROLES } from '~/lib/shared/labels';
import { NotFound } from '../errors';
import { Membership } from '../users/membership.entity';

export async function newInquiryRecipients(em: EntityManager, companyId: string): Promise<string[]> {
  const members = await em.find(
    Membership,
    { company: companyId, newInquiryMail: true, role: { $in: [...STAFF_ROLES] } },
    { populate: ['user'], orderBy: { user: { email: 'asc' } } },
  );
  return members.map((m) => m.user.email);
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

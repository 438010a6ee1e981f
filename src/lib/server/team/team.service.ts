import { LockMode } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { isId } from '~/lib/shared/ids';
import { Company } from '../companies/company.entity';
import { now } from '../clock';
import { Conflict, NotFound } from '../errors';
import { enqueueMail } from '../mail/outbox';
import { Membership, type Role } from '../users/membership.entity';
import { User } from '../users/user.entity';
import { endSessionsInFirm } from '../auth/sessions';
import { linkTokenDigest, newLinkToken } from '../auth/tokens';
import { Invite } from './invite.entity';
import { inviteMail } from './mails';

/** An invitation link works for a week. common practice, no source. */
export const INVITE_LIFETIME_MS = 7 * 24 * 60 * 60 * 1000;

export type TeamMember = {
  id: string;
  userId: string;
  name: string;
  email: string;
  role: Role;
  /** Whether the firm's new-inquiry e-mail reaches them (their own choice on their account page). */
  newInquiryMail: boolean;
};
export type PendingInvite = { id: string; email: string; role: Role; expiresAt: string };

/** The firm's people and its invitations that are still open. */
export async function listTeam(em: EntityManager, companyId: string): Promise<{ members: TeamMember[]; invites: PendingInvite[] }> {
  const [members, invites] = await Promise.all([
    em.find(Membership, { company: companyId }, { populate: ['user'], orderBy: { user: { name: 'asc' } } }),
    em.find(Invite, { company: companyId, acceptedAt: null, expiresAt: { $gt: now() } }, { orderBy: { createdAt: 'asc' } }),
  ]);
  return {
    members: members.map((m) => ({ id: m.id, userId: m.user.id, name: m.user.name, email: m.user.email, role: m.role, newInquiryMail: m.newInquiryMail })),
    invites: invites.map((i) => ({ id: i.id, email: i.email, role: i.role, expiresAt: i.expiresAt.toISOString() })),
  };
}

/**
 * Invites a person by e-mail. A newer invitation to the same address replaces an open one.
 * The e-mail is queued in the same transaction; its link carries a token stored only as a digest.
 */
export async function inviteToTeam(em: EntityManager, input: { companyId: string; invitedById: string; email: string; role: Role }): Promise<PendingInvite> {
  const company = await em.findOneOrFail(Company, { id: input.companyId });
  const already = await em.count(Membership, { company, user: { email: input.email } });
  if (already) throw new Conflict('This person is already on the team.', { email: 'Already on the team.' });
  const inviter = await em.findOne(User, { id: input.invitedById });

  await em.nativeDelete(Invite, { company, email: input.email, acceptedAt: null });
  const token = newLinkToken();
  const invite = em.create(Invite, {
    company,
    email: input.email,
    role: input.role,
    tokenDigest: linkTokenDigest('invite', token),
    invitedBy: inviter,
    expiresAt: new Date(now().getTime() + INVITE_LIFETIME_MS),
  });
  const mail = inviteMail({
    firmName: company.name,
    inviterName: inviter?.name ?? null,
    role: input.role,
    token,
    expiresAt: invite.expiresAt,
    timeZone: company.timeZone,
  });
  enqueueMail(em, { to: input.email, subject: mail.subject, text: mail.text, companyId: company.id });
  await em.flush();
  return { id: invite.id, email: invite.email, role: invite.role, expiresAt: invite.expiresAt.toISOString() };
}

/** Withdraws an open invitation of this firm. */
export async function cancelInvite(em: EntityManager, input: { companyId: string; inviteId: string }): Promise<void> {
  if (!isId(input.inviteId)) throw new NotFound('There is no open invitation with that id.');
  const removed = await em.nativeDelete(Invite, { id: input.inviteId, company: input.companyId, acceptedAt: null });
  if (!removed) throw new NotFound('There is no open invitation with that id.');
}

/**
 * Locks the firm's memberships for the rest of the transaction, so two owners demoting or removing
 * each other at the same moment cannot leave the firm without one.
 */
async function lockTeam(tx: EntityManager, companyId: string, membershipId: string): Promise<{ target: Membership; owners: number }> {
  if (!isId(membershipId)) throw new NotFound('There is no team member with that id.');
  const all = await tx.find(Membership, { company: companyId }, { lockMode: LockMode.PESSIMISTIC_WRITE, populate: ['user'] });
  const target = all.find((m) => m.id === membershipId);
  if (!target) throw new NotFound('There is no team member with that id.');
  return { target, owners: all.filter((m) => m.role === 'owner').length };
}

const LAST_OWNER = 'A firm always needs an owner. Make someone else an owner first.';

/**
 * Changes a member's role. The person's sessions in this firm end (except the one making the
 * change), so the new role starts with a fresh sign-in. Source: OWASP Session Management Cheat
 * Sheet, renew the session on privilege change (from memory).
 */
export async function changeRole(
  em: EntityManager,
  input: { companyId: string; membershipId: string; role: Role; actingSessionToken: string | null },
): Promise<TeamMember> {
  const member = await em.transactional(async (tx) => {
    const { target, owners } = await lockTeam(tx, input.companyId, input.membershipId);
    if (target.role === input.role) return target;
    if (target.role === 'owner' && owners <= 1) throw new Conflict(LAST_OWNER, { role: LAST_OWNER });
    target.role = input.role;
    await tx.flush();
    await endSessionsInFirm(tx, target.user.id, input.companyId, input.actingSessionToken);
    return target;
  });
  return { id: member.id, userId: member.user.id, name: member.user.name, email: member.user.email, role: member.role, newInquiryMail: member.newInquiryMail };
}

/** Removes a member from this firm (their account stays for other firms) and ends their sessions here. */
export async function removeMember(em: EntityManager, input: { companyId: string; membershipId: string }): Promise<void> {
  await em.transactional(async (tx) => {
    const { target, owners } = await lockTeam(tx, input.companyId, input.membershipId);
    if (target.role === 'owner' && owners <= 1) throw new Conflict(LAST_OWNER);
    const userId = target.user.id;
    tx.remove(target);
    await tx.flush();
    await endSessionsInFirm(tx, userId, input.companyId);
  });
}

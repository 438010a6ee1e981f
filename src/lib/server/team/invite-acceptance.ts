import type { EntityManager } from '@mikro-orm/postgresql';
import { now } from '../clock';
import { InvalidInput } from '../errors';
import { Membership, type Role } from '../users/membership.entity';
import { hashPassword, verifyPassword } from '../users/password';
import { User } from '../users/user.entity';
import { linkTokenDigest, looksLikeLinkToken } from '../auth/tokens';
import { Invite } from './invite.entity';

export type InviteView = { state: 'open'; firmName: string; email: string; role: Role; hasAccount: boolean } | { state: 'expired' | 'used' | 'unknown' };

export const LINK_PROBLEMS = {
  unknown: 'This invitation link is not valid. Check that the whole link was copied, or ask the owner for a new one.',
  expired: 'This invitation has expired. Ask the firm’s owner to invite you again.',
  used: 'This invitation has already been used. Sign in instead, or ask the owner for a new one.',
} as const;

async function findByToken(em: EntityManager, token: string): Promise<Invite | null> {
  if (!looksLikeLinkToken(token)) return null;
  return em.findOne(Invite, { tokenDigest: linkTokenDigest('invite', token) }, { populate: ['company'] });
}

/** What the invitation page shows for a link. */
export async function readInvite(em: EntityManager, token: string): Promise<InviteView> {
  const invite = await findByToken(em, token);
  if (!invite) return { state: 'unknown' };
  if (invite.acceptedAt) return { state: 'used' };
  if (invite.expiresAt <= now()) return { state: 'expired' };
  const user = await em.findOne(User, { email: invite.email }, { populate: ['passwordHash'] });
  return { state: 'open', firmName: invite.company.name, email: invite.email, role: invite.role, hasAccount: Boolean(user?.passwordHash) };
}

/**
 * Accepts an invitation. A new person gives a name and a password; someone who already signs in to
 * Lapwing confirms with their current password. The link is spent atomically in the same
 * transaction, so it works exactly once even if it is opened twice at the same moment.
 * Returns the person and the firm, for starting their session.
 */
export async function acceptInvite(
  em: EntityManager,
  token: string,
  input: { name?: string; password: string },
): Promise<{ userId: string; companyId: string }> {
  return em.transactional(async (tx) => {
    const invite = await findByToken(tx, token);
    if (!invite) throw new InvalidInput(LINK_PROBLEMS.unknown);
    const at = now();
    const spent = await tx.nativeUpdate(Invite, { id: invite.id, acceptedAt: null, expiresAt: { $gt: at } }, { acceptedAt: at });
    if (spent !== 1) throw new InvalidInput(invite.acceptedAt ? LINK_PROBLEMS.used : invite.expiresAt <= at ? LINK_PROBLEMS.expired : LINK_PROBLEMS.used);

    let user = await tx.findOne(User, { email: invite.email }, { populate: ['passwordHash'] });
    if (user?.passwordHash) {
      if (!(await verifyPassword(user.passwordHash, input.password))) {
        throw new InvalidInput('That is not your Lapwing password.', { password: 'That is not your Lapwing password.' });
      }
    } else {
      if (!input.name) throw new InvalidInput('Some fields need attention.', { name: 'Enter your name.' });
      const passwordHash = await hashPassword(input.password);
      if (user) {
        user.name = input.name;
        user.passwordHash = passwordHash;
      } else {
        user = tx.create(User, { email: invite.email, name: input.name, passwordHash });
      }
    }
    const member = await tx.findOne(Membership, { company: invite.company, user });
    if (!member) tx.create(Membership, { company: invite.company, user, role: invite.role });
    await tx.flush();
    return { userId: user.id, companyId: invite.company.id };
  });
}

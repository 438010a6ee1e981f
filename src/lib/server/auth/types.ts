export type { ActiveMembership } from '../users/types';

export type SignedInUser = { id: string; email: string; name: string };

export type CurrentSession = { token: string; expiresAt: Date; absoluteExpiresAt: Date };

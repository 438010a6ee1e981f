import type { Role } from '../users/membership.entity';

export type SignedInUser = { id: string; email: string; name: string };

/** The firm a person is working in right now, and their role there. */
export type ActiveMembership = { id: string; companyId: string; companyName: string; companySlug: string; role: Role };

export type CurrentSession = { token: string; expiresAt: Date; absoluteExpiresAt: Date };

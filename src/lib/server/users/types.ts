import type { Role } from './membership.entity';

/** The firm a person is working in right now, and their role there. */
export type ActiveMembership = { id: string; companyId: string; companyName: string; companySlug: string; role: Role };

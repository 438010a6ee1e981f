import { describe, expect, test } from 'vitest';
import { Forbidden, NotFound, Unauthenticated } from '~/lib/server/errors';
import { canSeeLead, canDeleteLead } from '~/lib/server/leads/policy';
import { canManageTeam } from '~/lib/server/team/policy';
import { authorize, requireStaff } from '~/lib/server/auth/guard';

const FIRM_A = 'a0000000-0000-4000-8000-00000000000a';
const FIRM_B = 'b0000000-0000-4000-8000-00000000000b';

function localsOf(role: 'owner' | 'sales', companyId = FIRM_A): App.Locals {
  return {
    user: { id: 'u1', email: 'sam@firm.test', name: 'Sam' },
    membership: { id: 'm1', companyId, companyName: 'Firm', companySlug: 'firm', role },
    session: { token: 't', expiresAt: new Date(0), absoluteExpiresAt: new Date(0) },
    memberships: [],
  } as unknown as App.Locals;
}

describe('the staff guard goes through the policies', () => {
  test('signed out is Unauthenticated; a policy that refuses the role is Forbidden', () => {
    expect(() => requireStaff({ memberships: [] } as unknown as App.Locals)).toThrow(Unauthenticated);
    expect(() => requireStaff(localsOf('sales'), { may: canManageTeam })).toThrow(Forbidden);
    expect(requireStaff(localsOf('owner'), { may: canManageTeam })).toMatchObject({ userId: 'u1', companyId: FIRM_A, role: 'owner' });
  });

  test('an object of another firm is NotFound (its id is not confirmed); one the role may not touch is Forbidden', () => {
    const sales = requireStaff(localsOf('sales'));
    expect(() => authorize(sales, canSeeLead, { company: { id: FIRM_B } })).toThrow(NotFound);
    expect(() => authorize(requireStaff(localsOf('owner')), canDeleteLead, { company: { id: FIRM_B } })).toThrow(NotFound);
    expect(() => authorize(sales, canDeleteLead, { company: { id: FIRM_A } })).toThrow(Forbidden);
    expect(() => authorize(sales, canSeeLead, { company: { id: FIRM_A } })).not.toThrow();
  });
});

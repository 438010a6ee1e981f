import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';

/** Who is signed in, in which firm, as what (for islands that adapt to the role). */
export const GET = staffEndpoint({}, ({ staff, locals }) =>
  Response.json({
    user: staff.user,
    firm: { id: staff.companyId, name: staff.membership.companyName, slug: staff.membership.companySlug },
    role: staff.role,
    firms: locals.memberships.map((m) => ({ id: m.companyId, name: m.companyName, role: m.role })),
  }),
);

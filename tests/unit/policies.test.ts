import { describe, expect, test } from 'vitest';
import { STAFF_ROLES, type StaffRole } from '~/lib/shared/labels';
import * as companyPolicies from '~/lib/server/companies/policy';
import * as leadPolicies from '~/lib/server/leads/policy';
import { leadActions } from '~/lib/server/leads/present-lead-actions';
import * as ratePolicies from '~/lib/server/rates/policy';
import * as reportPolicies from '~/lib/server/reports/policy';
import * as teamPolicies from '~/lib/server/team/policy';
import * as visitPolicies from '~/lib/server/visits/policy';
import type { FirmScoped, Viewer } from '~/lib/server/viewer';

const POLICIES: Record<string, (viewer: Viewer, target: FirmScoped) => boolean> = {
  ...companyPolicies,
  ...leadPolicies,
  ...ratePolicies,
  ...reportPolicies,
  ...teamPolicies,
  ...visitPolicies,
};

// Source: the product's roles as people are told them when invited (ROLE_LABELS in
// src/lib/shared/labels.ts): sales staff work Inquiries (triage, stages, assigning) and Visits; the
// owner does everything, including the Rate book, Setup and the team. Erasing an inquiry is the
// owner's (common practice, no source).
const SAME_FIRM: Record<string, Record<StaffRole, boolean>> = {
  canSeeLeads: { owner: true, sales: true },
  canSeeLead: { owner: true, sales: true },
  canEditLead: { owner: true, sales: true },
  canAssignLead: { owner: true, sales: true },
  canEnterLead: { owner: true, sales: true },
  canDeleteLead: { owner: true, sales: false },
  canExportLeads: { owner: true, sales: false },
  canSeeRates: { owner: true, sales: false },
  canEditRates: { owner: true, sales: false },
  canPublishRates: { owner: true, sales: false },
  canManageTeam: { owner: true, sales: false },
  canUseSetup: { owner: true, sales: false },
  // The firm's figures are the owner's, as the Rate book's margins are.
  canSeeReports: { owner: true, sales: false },
  canSeeVisits: { owner: true, sales: true },
  canManageVisit: { owner: true, sales: true },
  canEditVisitSettings: { owner: true, sales: false },
  // Someone else's hours (each person keeps their own: see the test below).
  canEditAvailability: { owner: true, sales: false },
};

const FIRM_A = 'a0000000-0000-4000-8000-00000000000a';
const FIRM_B = 'b0000000-0000-4000-8000-00000000000b';
const viewer = (role: StaffRole, companyId = FIRM_A): Viewer => ({ role, companyId, userId: 'c0000000-0000-4000-8000-00000000000c' });
const ownedBy = (companyId: string): FirmScoped => ({ company: { id: companyId } });

describe('permission policies', () => {
  test('every policy answers every role about its own firm’s objects as the role table says', () => {
    const seen = Object.keys(SAME_FIRM).flatMap((name) => STAFF_ROLES.map((role) => `${name} ${role}: ${POLICIES[name]!(viewer(role), ownedBy(FIRM_A))}`));
    expect(seen).toEqual(Object.entries(SAME_FIRM).flatMap(([name, byRole]) => STAFF_ROLES.map((role) => `${name} ${role}: ${byRole[role]}`)));
  });

  test('no policy lets any role touch another firm’s objects', () => {
    // Source: OWASP Authorization Cheat Sheet, deny by default and check access to each object (from memory).
    for (const name of Object.keys(SAME_FIRM)) {
      for (const role of STAFF_ROLES) expect(`${name} ${role}: ${POLICIES[name]!(viewer(role, FIRM_B), ownedBy(FIRM_A))}`).toBe(`${name} ${role}: false`);
    }
  });

  test('a policy about the firm itself, asked without an object, means the viewer’s active firm', () => {
    for (const name of ['canSeeLeads', 'canEnterLead', 'canSeeReports', 'canSeeRates', 'canEditRates', 'canPublishRates', 'canManageTeam', 'canUseSetup']) {
      const policy = POLICIES[name] as (viewer: Viewer) => boolean;
      for (const role of STAFF_ROLES) expect(`${name} ${role}: ${policy(viewer(role))}`).toBe(`${name} ${role}: ${SAME_FIRM[name]![role]}`);
    }
  });

  test('a role the code does not know is refused everything', () => {
    const stranger = viewer('contractor' as StaffRole);
    for (const [name, policy] of Object.entries(POLICIES)) expect(`${name}: ${policy(stranger, ownedBy(FIRM_A))}`).toBe(`${name}: false`);
  });

  test('the table lists every policy the domains export, and nothing else', () => {
    expect(Object.keys(POLICIES).sort()).toEqual(Object.keys(SAME_FIRM).sort());
  });
});

describe('weekly hours', () => {
  test('a salesperson keeps their own hours, not a teammate’s; the owner keeps anyone’s', () => {
    const me = viewer('sales');
    const mine = { ...ownedBy(FIRM_A), user: { id: me.userId } };
    const theirs = { ...ownedBy(FIRM_A), user: { id: 'd0000000-0000-4000-8000-00000000000d' } };
    expect([visitPolicies.canEditAvailability(me, mine), visitPolicies.canEditAvailability(me, theirs)]).toEqual([true, false]);
    expect(visitPolicies.canEditAvailability(viewer('owner'), theirs)).toBe(true);
    expect(visitPolicies.canEditAvailability(viewer('sales', FIRM_B), { ...ownedBy(FIRM_A), user: { id: me.userId } })).toBe(false);
  });
});

describe('what islands are told they may do with a lead', () => {
  test('sales may edit and assign but not erase; the owner may do all three', () => {
    expect(leadActions(viewer('sales'), ownedBy(FIRM_A))).toEqual({ edit: true, assign: true, delete: false });
    expect(leadActions(viewer('owner'), ownedBy(FIRM_A))).toEqual({ edit: true, assign: true, delete: true });
  });

  test('another firm’s lead offers nothing, whatever the role', () => {
    expect(leadActions(viewer('owner', FIRM_B), ownedBy(FIRM_A))).toEqual({ edit: false, assign: false, delete: false });
    expect(leadActions(viewer('sales', FIRM_B), ownedBy(FIRM_A))).toEqual({ edit: false, assign: false, delete: false });
  });

  test('the map is plain JSON booleans, so it can go into an island’s props as it is', () => {
    const actions = leadActions(viewer('sales'), ownedBy(FIRM_A));
    expect(JSON.parse(JSON.stringify(actions))).toEqual(actions);
  });
});

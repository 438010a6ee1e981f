import type { LeadActions } from '~/lib/shared/allowed-actions';
import { allowedActions, type FirmScoped, type Viewer } from '../viewer';
import { canAssignLead, canDeleteLead, canEditLead } from './policy';

const LEAD_ACTION_POLICIES = { edit: canEditLead, assign: canAssignLead, delete: canDeleteLead } satisfies Record<keyof LeadActions, unknown>;

/** What the viewer may do with this lead, for an island's props. */
export function leadActions(viewer: Viewer, lead: FirmScoped): LeadActions {
  return allowedActions(viewer, lead, LEAD_ACTION_POLICIES);
}

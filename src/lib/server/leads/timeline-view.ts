/**
 * The inquiry's timeline as the page shows it, with the workflow values the page's controls show
 * (stage, assignee, follow-up), so one answer refreshes both after any action.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { LEAD_EVENT_LABELS } from '~/lib/shared/lead-events';
import { describeLeadEvent } from '~/lib/shared/timeline-text';
import type { TimelineView } from '~/lib/shared/inquiry-timeline';
import { instantToLocalInput } from '~/lib/shared/zone-input';
import type { Viewer } from '../viewer';
import { firmFormats } from '../rates/firm-formats';
import type { Lead } from './lead.entity';
import type { LeadEvent } from './lead-event.entity';
import { leadTimeline } from './lead-events';
import { UNDOABLE_KINDS } from './lead-flow';
import { canAssignLead, canEditLead } from './policy';

function actorName(event: LeadEvent): string {
  if (event.actor) return event.actor.name;
  if (event.kind === 'viewed-by-homeowner' || (event.kind === 'received' && event.data.source !== 'staff')) return 'The homeowner';
  return 'Lapwing';
}

/** The entries the viewer may undo now: the latest one of each undoable kind still in force. */
function undoableIds(events: LeadEvent[], lead: Lead, viewer: Viewer): Set<string> {
  const ids = new Set<string>();
  for (const kind of UNDOABLE_KINDS) {
    const may = kind === 'assigned' ? canAssignLead(viewer, lead) : canEditLead(viewer, lead);
    const latest = events.filter((e) => e.kind === kind && !e.undoneAt).at(-1);
    if (!may || !latest) continue;
    const inForce = kind === 'stage-moved' ? latest.data.to === lead.stage : (latest.data.to ?? null) === (lead.assignee?.id ?? null);
    if (inForce) ids.add(latest.id);
  }
  return ids;
}

export async function timelineView(em: EntityManager, viewer: Viewer, lead: Lead): Promise<TimelineView> {
  const fmt = await firmFormats(em, viewer.companyId);
  const events = await leadTimeline(em, viewer.companyId, lead.id);
  await em.populate(events, ['undoneBy']);
  const undoable = undoableIds(events, lead, viewer);
  const when = (at: Date | string) => fmt.date(at, 'dateTime');
  return {
    state: {
      stage: lead.stage,
      lostReason: lead.lostReason,
      assigneeId: lead.assignee?.id ?? null,
      nextFollowUpAt: lead.nextFollowUpAt?.toISOString() ?? null,
      nextFollowUpText: lead.nextFollowUpAt ? when(lead.nextFollowUpAt) : null,
      nextFollowUpInput: lead.nextFollowUpAt ? instantToLocalInput(lead.nextFollowUpAt, fmt.timeZone) : null,
    },
    events: events.map((event) => ({
      id: event.id,
      kind: event.kind,
      label: LEAD_EVENT_LABELS[event.kind] ?? event.kind,
      at: fmt.isoDate(event.at),
      when: when(event.at),
      who: actorName(event),
      text: describeLeadEvent(event.kind, event.data, when),
      undoable: undoable.has(event.id),
      undone: event.undoneAt ? { when: when(event.undoneAt), who: event.undoneBy?.name ?? 'someone no longer on the team' } : null,
    })),
  };
}

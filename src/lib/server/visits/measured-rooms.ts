/**
 * The rooms as measured on the site visit. Once a visit is done, the salesperson enters the rooms
 * in the widget's own room form; they are priced with the firm's published Rate book as a site
 * measurement (the core's `measuredBy: 'site-measure'`, whose spread in the Rate book is the
 * narrowest), stored on the inquiry as its inputs and estimate, and the inquiry moves to Measured.
 *
 * The earlier estimate is kept in the timeline: a `re-estimated` entry with
 * `data: { before: {lowCents, highCents}, after: {lowCents, highCents}, previous: { inputs, estimate,
 * rateBookVersionId }, text }`, where `previous.inputs` and `previous.estimate` are the envelopes the
 * inquiry held before (read them with `leadInputs` and `estimateSnapshot`).
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import type { MeasuredBy, Project } from '~/lib/estimate';
import type { LeadStage } from '~/lib/shared/labels';
import type { RangeCents } from '~/lib/shared/measured-rooms-schemas';
import { Conflict } from '../errors';
import { now as clockNow } from '../clock';
import type { Viewer } from '../viewer';
import { authorize } from '../auth/guard';
import { Company } from '../companies/company.entity';
import { estimateForFirm, type FirmEstimate } from '../estimates/estimate.service';
import { estimateSnapshot } from '../estimates/estimate-snapshot';
import type { Lead } from '../leads/lead.entity';
import { leadInputs } from '../leads/lead-inputs';
import { recordLeadEvent } from '../leads/lead-events';
import { workableLead } from '../leads/lead-flow';
import { finishFacts } from '../leads/list-search';
import { canEditLead } from '../leads/policy';
import { refreshTriageScore } from '../leads/triage';
import { Visit } from './visit.entity';

/** Stages before the measurement: saving the measured rooms moves the inquiry on to Measured from these. */
const BEFORE_MEASURED: LeadStage[] = ['new', 'spoken-to', 'visit-booked'];

const MEASURED_BY_WORDS: Record<MeasuredBy, string> = {
  'homeowner-estimate': "the homeowner's estimate",
  'homeowner-tape': "the homeowner's tape measure",
  'site-measure': 'a site measurement',
};

/** The inquiry's latest visit marked done, if any: it is what opens the measured rooms. */
export function latestDoneVisit(em: EntityManager, companyId: string, leadId: string): Promise<Visit | null> {
  return em.findOne(Visit, { company: companyId, lead: leadId, status: 'done' }, { orderBy: { startsAt: 'desc' } });
}

/** What a site measurement prices: the measured rooms, with the photos and trip zone the inquiry already had. */
export function measuredProject(rooms: Project, stored: Project): Project {
  const tripZone = rooms.tripZone ?? stored.tripZone;
  return { ...rooms, measuredBy: 'site-measure', photoCount: stored.photoCount, ...(tripZone ? { tripZone } : {}) };
}

/**
 * Puts a new estimate of the measured rooms on the inquiry (inputs, snapshot, range, list facts),
 * keeps the earlier one in a `re-estimated` entry and moves the stage on to Measured. The inquiry
 * must have its estimate loaded. Persisted on the next flush.
 */
export function applyMeasuredEstimate(
  em: EntityManager,
  lead: Lead,
  project: Project,
  priced: Pick<FirmEstimate, 'result' | 'version'>,
  options: { actorUserId: string | null; at: Date },
): void {
  const previous = estimateSnapshot.read(lead.estimate);
  const before: RangeCents = { lowCents: previous.price.lowCents, highCents: previous.price.highCents };
  const after: RangeCents = { lowCents: priced.result.price.lowCents, highCents: priced.result.price.highCents };
  recordLeadEvent(em, lead, 're-estimated', {
    actorUserId: options.actorUserId,
    at: options.at,
    data: {
      before,
      after,
      previous: { inputs: lead.inputs, estimate: lead.estimate, rateBookVersionId: lead.rateBookVersion.id },
      text:
        `${priced.result.price.rangeText} from ${MEASURED_BY_WORDS[project.measuredBy]} ` +
        `(was ${previous.price.rangeText} from ${MEASURED_BY_WORDS[previous.takeoff.facts.measuredBy]})`,
    },
  });
  lead.inputs = leadInputs.wrap(project);
  lead.estimate = estimateSnapshot.wrap(priced.result);
  lead.rateBookVersion = priced.version;
  lead.rangeLowCents = after.lowCents;
  lead.rangeHighCents = after.highCents;
  // The list shows the finish and the covered area beside each inquiry; they follow the new rooms.
  const finish = finishFacts(priced.result.takeoff.rooms);
  lead.finishLabel = finish.label;
  lead.finishKinds = finish.kinds;
  lead.coveredSqFt = Math.round(priced.result.takeoff.netSqFt);
  if (BEFORE_MEASURED.includes(lead.stage)) {
    recordLeadEvent(em, lead, 'stage-moved', { actorUserId: options.actorUserId, at: options.at, data: { from: lead.stage, to: 'measured' } });
    lead.stage = 'measured';
  }
}

/**
 * Saves the rooms measured on the site visit (already parsed by the core's project schema) and
 * re-prices the inquiry. 409 until one of its visits is marked done; rooms the Rate book cannot
 * price are a 400 under `project.…`, as for the phone form.
 */
export async function saveMeasuredRooms(em: EntityManager, viewer: Viewer, leadId: string, rooms: Project, now = clockNow()): Promise<Lead> {
  const found = await workableLead(em, viewer, leadId);
  authorize(viewer, canEditLead, found);
  if (!(await latestDoneVisit(em, viewer.companyId, found.id))) {
    throw new Conflict('Mark the site visit done first: the measured rooms come from it.', { project: 'No site visit of this inquiry is marked done yet.' });
  }
  const company = await em.findOneOrFail(Company, { id: viewer.companyId });
  const project = measuredProject(rooms, leadInputs.read(found.inputs));
  // Priced before the inquiry's row is locked: the estimate runs on the worker pool and may take a while.
  const priced = await estimateForFirm(em, company, project);
  return em.transactional(async (tx) => {
    const lead = await workableLead(tx, viewer, leadId, true);
    await tx.populate(lead, ['estimate', 'rateBookVersion']);
    applyMeasuredEstimate(tx, lead, project, priced, { actorUserId: viewer.userId, at: now });
    await refreshTriageScore(tx, lead, now);
    return lead;
  });
}

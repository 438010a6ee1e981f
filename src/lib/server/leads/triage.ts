/**
 * The triage score of a stored inquiry: the facts `triageScore` needs, gathered from the lead, its
 * firm (service area) and the firm's published Rate book (the weights, defaults until it sets them).
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { DEFAULT_TRIAGE_WEIGHTS } from '~/lib/estimate/schemas.ts';
import { triageScore, type Triage } from '~/lib/shared/triage-score';
import { Company } from '../companies/company.entity';
import { servesPostcode } from '../companies/service-area';
import { estimateSnapshot } from '../estimates/estimate-snapshot';
import { firmFormats } from '../rates/firm-formats';
import { publishedRatesIfAny } from '../rates/rate-book.service';
import type { Lead } from './lead.entity';

/** The score and its reasons as of `now` (the response reason changes as the target passes). */
export async function triageOfLead(em: EntityManager, lead: Lead, now = new Date()): Promise<Triage> {
  const companyId = lead.company.id;
  const company = lead.company.timeZone ? lead.company : await em.findOneOrFail(Company, { id: companyId });
  if (!lead.estimate) await em.populate(lead, ['estimate']);
  const { takeoff } = estimateSnapshot.read(lead.estimate);
  const [published, fmt] = await Promise.all([publishedRatesIfAny(em, companyId), firmFormats(em, company)]);
  return triageScore(
    {
      insideServiceArea: servesPostcode(company, lead.postcode),
      hasServiceArea: company.servicePostcodes.length > 0,
      coveredSqFt: takeoff.netSqFt,
      photoCount: takeoff.facts.photoCount,
      measuredBy: takeoff.facts.measuredBy,
      firstContactAt: lead.firstContactAt,
      responseDueAt: lead.responseDueAt,
      now,
    },
    published?.rateBook.triage ?? DEFAULT_TRIAGE_WEIGHTS,
    (sqFt) => fmt.area(sqFt),
  );
}

/**
 * Works the score out again and sets `lead.triageScore` (stored on the caller's next flush). Call it
 * after anything that changes a reason: a first contact, photos, a merge.
 */
export async function refreshTriageScore(em: EntityManager, lead: Lead, now = new Date()): Promise<Triage> {
  const triage = await triageOfLead(em, lead, now);
  lead.triageScore = triage.score;
  return triage;
}

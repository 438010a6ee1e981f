// Invented demo leads: names, streets and phone numbers are made up (555-01xx numbers are reserved
// for fiction); e-mail addresses use the reserved .test domain.
import { createHash } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { estimate, type ProjectInput, type RateBook } from '~/lib/estimate';
import type { Company } from '../companies/company.entity';
import { estimateSnapshot } from '../estimates/estimate-snapshot';
import { recordLeadEvent } from '../leads/lead-events';
import { Lead } from '../leads/lead.entity';
import { refreshTriageScore } from '../leads/triage';
import { Membership } from '../users/membership.entity';
import { DEFAULT_LOST_REASONS } from '~/lib/shared/lead-flow-schemas';
import { leadInputs } from '../leads/lead-inputs';
import { newLeadReference } from '../leads/lead-reference';
import type { LeadStage } from '~/lib/shared/labels';
import type { RateBookVersion } from '../rates/rate-book-version.entity';

const FIRST = [
  'Maya',
  'Jonah',
  'Priya',
  'Elliot',
  'Rosa',
  'Dev',
  'Hannah',
  'Tomas',
  'Grace',
  'Omar',
  'Leah',
  'Wes',
  'Ines',
  'Caleb',
  'Noor',
  'Felix',
  'June',
  'Arlo',
  'Tess',
  'Ravi',
];
const LAST = [
  'Pike',
  'Alder',
  'Quill',
  'Hartwell',
  'Osei',
  'Lund',
  'Marsh',
  'Castillo',
  'Brandt',
  'Yoon',
  'Farrow',
  'Nakamura',
  'Doyle',
  'Ibarra',
  'Kessler',
  'Moreau',
  'Sato',
  'Whitlock',
  'Varga',
  'Ellery',
];
const STREETS = ['Juniper Bend', 'Millrace Lane', 'Copper Hollow Rd', 'Larkspur Ct', 'Old Quarry Way', 'Tanager St', 'Fieldstone Dr', 'Bramble Row'];
const ROOMS: { name: string; length: number; width: number; damp?: boolean }[] = [
  { name: 'Dining room', length: 156, width: 132 },
  { name: 'Living room', length: 204, width: 168 },
  { name: 'Hallway', length: 180, width: 42 },
  { name: 'Main bedroom', length: 168, width: 150 },
  { name: 'Bathroom', length: 96, width: 72, damp: true },
  { name: 'Entry', length: 84, width: 72 },
];
/** How many demo leads sit in each stage (40 in all). */
const STAGE_MIX: [LeadStage, number][] = [
  ['new', 12],
  ['spoken-to', 7],
  ['visit-booked', 6],
  ['measured', 4],
  ['quote-sent', 4],
  ['going-ahead', 4],
  ['not-going-ahead', 3],
];

/** A small deterministic generator so the demo looks the same on every machine. */
function generator(seed: number) {
  let state = seed >>> 0;
  return () => {
    state = (state * 1664525 + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
}

export async function seedDemoLeads(em: EntityManager, company: Company, version: RateBookVersion, rateBook: RateBook, postcodes: string[]): Promise<number> {
  if ((await em.count(Lead, { company })) > 0) return 0;
  // Who worked the demo inquiries past the first stage: the firm's first salesperson, else its owner.
  const team = await em.find(Membership, { company }, { populate: ['user'], orderBy: { role: 'desc', createdAt: 'asc' } });
  const worker = team[0] ?? null;
  const stored: Lead[] = [];
  const random = generator(company.slug.length * 7919);
  const pick = <T>(list: readonly T[]): T => list[Math.floor(random() * list.length)]!;
  const treatments = rateBook.catalogue.treatments.filter((t) => t.enabled).map((t) => t.id);
  let index = 0;
  for (const [stage, count] of STAGE_MIX) {
    for (let i = 0; i < count; i++, index++) {
      const first = pick(FIRST);
      const last = pick(LAST);
      const roomCount = 1 + Math.floor(random() * 3);
      const rooms = Array.from({ length: roomCount }, (_, r) => {
        const room = ROOMS[(index + r) % ROOMS.length]!;
        const full = random() < 0.3;
        return {
          name: room.name,
          ceilingHeight: random() < 0.8 ? 96 : 108,
          length: room.length,
          width: room.width,
          walls: [
            { side: 'length' as const, openings: random() < 0.5 ? [{ kind: 'window' as const }] : [], outlets: 2 },
            { side: 'width' as const, openings: [{ kind: 'door' as const }], outlets: 1, switches: 1 },
          ],
          treatment: full ? { id: pick(treatments), height: 'full' as const } : { id: pick(treatments), height: 'wainscot' as const, wainscotHeight: 36 },
          replaceBaseboard: random() < 0.5,
          damp: room.damp ?? false,
        };
      });
      const project: ProjectInput = {
        rooms,
        paint: random() < 0.7,
        builtBefore1978: pick(['yes', 'no', 'no', 'not-sure'] as const),
        measuredBy: pick(['homeowner-estimate', 'homeowner-tape'] as const),
        photoCount: 0,
      };
      let result;
      try {
        result = estimate(project, rateBook);
      } catch {
        // A random room the firm's catalogue cannot price (e.g. a switched-off treatment): skip it.
        continue;
      }
      const daysAgo = Math.floor((index / 40) * 60 + random() * 2);
      const createdAt = new Date(Date.now() - daysAgo * 86_400_000 - Math.floor(random() * 36_000_000));
      const email = `${first}.${last}${index}`.toLowerCase() + '@homeowner.test';
      const lead = em.create(Lead, {
        company,
        reference: newLeadReference(),
        stage,
        name: `${first} ${last}`,
        email,
        phone: `+1${company.phone?.replace(/\D/g, '').slice(1, 4) ?? '512'}55501${String(index % 100).padStart(2, '0')}`,
        address: `${100 + Math.floor(random() * 8800)} ${pick(STREETS)}`,
        postcode: `${pick(postcodes)}${String(Math.floor(random() * 100)).padStart(2, '0')}`,
        preferredContact: pick(['phone', 'email', 'text'] as const),
        message: random() < 0.3 ? 'We would like this done before the holidays if possible.' : null,
        consentAt: createdAt,
        inputs: leadInputs.wrap(project),
        estimate: estimateSnapshot.wrap(result),
        rateBookVersion: version,
        rangeLowCents: result.price.lowCents,
        rangeHighCents: result.price.highCents,
        idempotencyKey: `demo-${company.slug}-${index}`,
        viewTokenHash: createHash('sha256').update(`demo-${company.slug}-${index}`).digest('hex'),
        createdAt,
        updatedAt: createdAt,
      });
      recordLeadEvent(em, lead, 'received', { at: createdAt, data: { source: 'widget' } });
      if (stage !== 'new' && worker) workedHistory(em, lead, worker, index);
      stored.push(lead);
    }
  }
  await em.flush();
  // Scored as any stored inquiry is, so the list's score column and its sort mean something.
  for (const lead of stored) await refreshTriageScore(em, lead);
  await em.flush();
  return index;
}

/**
 * An inquiry past New inquiry was opened, called within a few hours and moved to its stage by the
 * firm's salesperson, so the demo list shows worked inquiries rather than every one overdue. No
 * random draws here: the rest of the demo stays as it was.
 */
function workedHistory(em: EntityManager, lead: Lead, worker: Membership, index: number): void {
  const hour = 3_600_000;
  const latest = Date.now() - 60_000;
  const at = (hours: number) => new Date(Math.min(lead.createdAt.getTime() + hours * hour, latest));
  const opened = at(0.5);
  const called = at(1 + (index % 3));
  const moved = at(2 + (index % 3));
  const actorUserId = worker.user.id;
  lead.openedAt = opened;
  lead.firstContactAt = called;
  lead.lastContactAt = called;
  if (lead.stage === 'not-going-ahead') lead.lostReason = DEFAULT_LOST_REASONS[index % DEFAULT_LOST_REASONS.length]!;
  recordLeadEvent(em, lead, 'opened', { actorUserId, at: opened });
  recordLeadEvent(em, lead, 'call', { actorUserId, at: called, data: { outcome: 'reached' } });
  const data: Record<string, unknown> = { from: 'new', to: lead.stage };
  if (lead.lostReason) data.reason = lead.lostReason;
  recordLeadEvent(em, lead, 'stage-moved', { actorUserId, at: moved, data });
}

/**
 * The morning digest: each morning (07:30 on the firm's clock) every owner and salesperson with open
 * inquiries gets one e-mail listing them, overdue ones first. Overdue: no first contact yet and past
 * `responseDueAt`. A salesperson's list is the inquiries assigned to them; an owner's also holds the
 * ones nobody has yet. The job runs every quarter hour; `InquiryDigest` (unique per person and day,
 * written in the same transaction as the e-mail) makes every later run that day send nothing more.
 */
import { UniqueConstraintViolationException } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { stageLabel } from '~/lib/shared/labels';
import { Company } from '../companies/company.entity';
import { config } from '../config';
import { defineJob } from '../jobs/runner';
import { ENDED_STAGES } from '../leads/duplicates';
import { InquiryDigest } from '../leads/inquiry-digest.entity';
import { Lead } from '../leads/lead.entity';
import { kickMailDelivery } from '../mail/delivery-job';
import { enqueueMail } from '../mail/outbox';
import { firmFormats } from '../rates/firm-formats';
import { Membership } from '../users/membership.entity';
import { digestDueToday } from './digest-time';

/** Most inquiries one digest lists; the rest are counted. */
const MAX_LISTED = 50;

export const isOverdue = (lead: Pick<Lead, 'firstContactAt' | 'responseDueAt'>, now: Date): boolean =>
  lead.firstContactAt === null && lead.responseDueAt !== null && lead.responseDueAt.getTime() < now.getTime();

export type DigestRun = { firms: number; sent: number };

/** Queues today's digest for every person whose firm's morning has come and who has not had it yet. */
export async function sendMorningDigests(em: EntityManager, { now = new Date(), companyIds }: { now?: Date; companyIds?: string[] } = {}): Promise<DigestRun> {
  const firms = await em.fork().find(Company, companyIds ? { id: { $in: companyIds } } : {}, { orderBy: { id: 'asc' } });
  let sent = 0;
  let due = 0;
  for (const company of firms) {
    const today = digestDueToday(now, company.timeZone);
    if (!today.due) continue;
    due++;
    sent += await sendFirmDigests(em.fork(), company, today.day, now);
  }
  if (sent > 0) kickMailDelivery();
  return { firms: due, sent };
}

async function sendFirmDigests(em: EntityManager, company: Company, day: string, now: Date): Promise<number> {
  const already = new Set((await em.find(InquiryDigest, { company, day }, { fields: ['membership'] })).map((d) => d.membership.id));
  const members = (await em.find(Membership, { company }, { populate: ['user'] })).filter((m) => !already.has(m.id));
  if (members.length === 0) return 0;
  const open = await em.find(Lead, { company, deletedAt: null, mergedInto: null, stage: { $nin: [...ENDED_STAGES] } }, { orderBy: { createdAt: 'asc' } });
  const fmt = await firmFormats(em, company);
  let sent = 0;
  for (const member of members) {
    const mine = open.filter((l) => l.assignee?.id === member.id || (member.role === 'owner' && l.assignee === null));
    if (mine.length === 0) continue;
    const mail = digestMail(company, member, mine, now, fmt.date.bind(fmt));
    try {
      await em.fork().transactional(async (tx) => {
        tx.create(InquiryDigest, { company: company.id, membership: member.id, day });
        enqueueMail(tx, { to: member.user.email, ...mail, companyId: company.id });
        await tx.flush();
      });
      sent++;
    } catch (error) {
      // Another run (another process, a retry) queued this person's digest for today first.
      if (!(error instanceof UniqueConstraintViolationException)) throw error;
    }
  }
  return sent;
}

type DateWriter = (at: Date, style: 'day' | 'dateTime') => string;

function digestMail(company: Company, member: Membership, leads: Lead[], now: Date, date: DateWriter): { subject: string; text: string } {
  const overdue = leads.filter((l) => isOverdue(l, now));
  const waiting = leads.filter((l) => !isOverdue(l, now));
  const line = (l: Lead) =>
    `- ${l.reference}  ${l.name}  · ${stageLabel(l.stage)} · received ${date(l.createdAt, 'day')}` +
    (isOverdue(l, now) ? ` · first contact was due ${date(l.responseDueAt!, 'dateTime')}` : '') +
    (l.assignee === null ? ' · nobody has it yet' : '') +
    `\n  ${config.publicOrigin}/app/leads/${l.id}`;
  const section = (title: string, list: Lead[]) => {
    if (list.length === 0) return [];
    const shown = list.slice(0, MAX_LISTED);
    return [title, ...shown.map(line), ...(list.length > shown.length ? [`…and ${list.length - shown.length} more in Inquiries.`] : []), ''];
  };
  const count = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;
  const subject = `${company.name}: ${count(leads.length, 'open inquiry', 'open inquiries')}${overdue.length ? `, ${overdue.length} overdue` : ''}`;
  const text = [
    `Good morning, ${member.user.name}.`,
    '',
    `You have ${count(leads.length, 'open inquiry', 'open inquiries')} at ${company.name}${overdue.length ? `, ${overdue.length} waiting past the response target` : ''}.`,
    '',
    ...section('Overdue — no first contact yet:', overdue),
    ...section('Open:', waiting),
    `All inquiries: ${config.publicOrigin}/app`,
    '',
    'You get this e-mail each morning while inquiries are open for you.',
  ].join('\n');
  return { subject, text };
}

export const morningDigestJob = defineJob({
  name: 'leads-morning-digest',
  // Every quarter hour: each firm's 07:30 comes in its own zone, and a missed run is made up by the next.
  schedule: '*/15 * * * *',
  queue: { policy: 'stately', retryLimit: 2, expireInSeconds: 10 * 60 },
  pollingIntervalSeconds: 30,
  async run(_data, { em }) {
    await sendMorningDigests(em);
  },
});

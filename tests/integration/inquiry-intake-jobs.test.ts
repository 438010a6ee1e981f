/**
 * The scheduled work of inquiry intake: purging inquiries deleted more than 30 days ago (stored
 * photos included) and the morning digest, once per person per day. Rows are back-dated and the
 * clock is passed in, instead of waiting. The database is this file's own, since both jobs sweep
 * every firm.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { Lead } from '../../src/lib/server/leads/lead.entity';
import { LeadEvent } from '../../src/lib/server/leads/lead-event.entity';
import { recordLeadEvent } from '../../src/lib/server/leads/lead-events';
import { LeadPhoto } from '../../src/lib/server/photos/lead-photo.entity';
import { OutboxMail } from '../../src/lib/server/mail/outbox-mail.entity';
import { purgeDeletedLeads, purgeDeletedLeadsJob } from '../../src/lib/server/intake/purge-deleted-leads';
import { morningDigestJob, sendMorningDigests } from '../../src/lib/server/intake/morning-digest';
import { headObject, putObject } from '../../src/lib/server/storage/s3';
import { refreshTriageScore } from '../../src/lib/server/leads/triage';
import { overdueTriageJob, refreshOverdueTriage } from '../../src/lib/server/leads/triage-refresh';
import { buildFirm } from '../helpers/accounts';
import { buildLead } from '../helpers/factories';
import { openMigratedDatabase } from '../helpers/migrated-database';

const DAY = 24 * 60 * 60 * 1000;

let orm: MikroORM;
let closeDatabase: () => Promise<void>;
beforeAll(async () => {
  ({ orm, close: closeDatabase } = await openMigratedDatabase());
});
afterAll(async () => {
  await closeDatabase?.();
});
const em = () => orm.em.fork();
const noSend = async () => null;

describe('purging deleted inquiries', () => {
  test('after 30 days only: the row, its timeline, its photo rows and stored files go; younger, live and merged ones stay', async () => {
    const { company } = await buildFirm(em(), [{ name: 'Pim', role: 'owner' }]);
    const tx = em();
    const at = (days: number) => new Date(Date.now() - days * DAY);
    const old = buildLead(tx, company.id);
    old.deletedAt = at(31);
    const recent = buildLead(tx, company.id);
    recent.deletedAt = at(29);
    const live = buildLead(tx, company.id);
    const mergedAway = buildLead(tx, company.id);
    mergedAway.deletedAt = at(40);
    mergedAway.mergedInto = live;
    recordLeadEvent(tx, old, 'deleted', { at: at(31) });
    const keys = [`photos/${company.id}/${randomUUID()}.jpg`, `thumbs/${company.id}/${randomUUID()}.jpg`];
    for (const key of keys) await putObject(key, Buffer.from('stored bytes'), 'image/jpeg');
    tx.create(LeadPhoto, {
      company,
      draftId: randomUUID(),
      lead: old,
      status: 'ready',
      uploadKey: `uploads/${company.id}/${randomUUID()}`,
      imageKey: keys[0]!,
      thumbKey: keys[1]!,
      originalName: 'hall.jpg',
    });
    await tx.flush();

    // Source: the rule "restorable for 30 days, then purged by a scheduled job".
    expect(await purgeDeletedLeads(em())).toEqual({ purged: 1 });
    expect(await em().count(Lead, { id: old.id })).toBe(0);
    expect(await em().count(LeadEvent, { lead: old.id })).toBe(0);
    expect(await em().count(LeadPhoto, { lead: old.id })).toBe(0);
    for (const key of keys) expect(await headObject(key)).toBeNull();
    expect((await em().find(Lead, { id: { $in: [recent.id, live.id, mergedAway.id] } })).length).toBe(3);

    // The scheduled job does the same work; nothing is left for it now.
    await purgeDeletedLeadsJob.run({}, { em: em(), send: noSend });
    expect(await em().count(Lead, { company })).toBe(3);
    // A day later the 29-day-old one is past its window too.
    expect(await purgeDeletedLeads(em(), { now: Date.now() + 2 * DAY })).toEqual({ purged: 1 });
    expect(await em().count(Lead, { id: recent.id })).toBe(0);
  });
});

describe('the morning digest', () => {
  test('07:30 on the firm’s clock, each person their own open and overdue inquiries, once a day however often it runs', async () => {
    const { company, members } = await buildFirm(
      em(),
      [
        { name: 'Odile', role: 'owner' },
        { name: 'Sven', role: 'sales' },
        { name: 'Tilde', role: 'sales' },
      ],
      { timeZone: 'America/Chicago' },
    );
    const [owner, sven] = members;
    const tx = em();
    const overdue = buildLead(tx, company.id, { name: 'Ulla Overdue' });
    overdue.assignee = sven!.membership;
    overdue.responseDueAt = new Date('2026-12-03T20:00:00Z');
    const waiting = buildLead(tx, company.id, { name: 'Wim Waiting' });
    waiting.assignee = sven!.membership;
    waiting.responseDueAt = new Date('2026-12-05T20:00:00Z');
    const contacted = buildLead(tx, company.id, { name: 'Cora Contacted' });
    contacted.assignee = sven!.membership;
    contacted.responseDueAt = new Date('2026-12-03T20:00:00Z');
    contacted.firstContactAt = new Date('2026-12-03T18:00:00Z');
    const nobodys = buildLead(tx, company.id, { name: 'Nils Nobody' });
    const ended = buildLead(tx, company.id, { name: 'Enid Ended' });
    ended.assignee = sven!.membership;
    ended.stage = 'going-ahead';
    await tx.flush();
    const digests = () => em().find(OutboxMail, { company, subject: { $like: `${company.name}:%` } }, { orderBy: { toAddress: 'asc' } });

    // Source: IANA tz (America/Chicago, CST = UTC−6 in December): 13:29 UTC is 07:29 there.
    expect(await sendMorningDigests(em(), { now: new Date('2026-12-04T13:29:00Z'), companyIds: [company.id] })).toEqual({ firms: 0, sent: 0 });
    const now = new Date('2026-12-04T13:31:00Z');
    const runs = await Promise.all([1, 2, 3].map(() => sendMorningDigests(em(), { now, companyIds: [company.id] })));
    expect(runs.reduce((sum, r) => sum + r.sent, 0)).toBe(2);
    // Later that morning: nothing more.
    expect((await sendMorningDigests(em(), { now: new Date('2026-12-04T16:00:00Z'), companyIds: [company.id] })).sent).toBe(0);

    const mails = await digests();
    // Tilde has nothing open, so gets nothing.
    expect(mails.map((m) => m.toAddress).sort()).toEqual([owner!.email, sven!.email].sort());
    const svens = mails.find((m) => m.toAddress === sven!.email)!;
    expect(svens.subject).toBe(`${company.name}: 3 open inquiries, 1 overdue`);
    const [overdueSection, openSection] = svens.textBody.split('\nOpen:\n');
    expect(overdueSection).toContain(overdue.reference);
    expect(overdueSection).not.toContain(waiting.reference);
    expect(openSection).toContain(waiting.reference);
    expect(openSection).toContain(contacted.reference);
    expect(svens.textBody).not.toContain(ended.reference);
    expect(svens.textBody).not.toContain(nobodys.reference);
    const owners = mails.find((m) => m.toAddress === owner!.email)!;
    expect(owners.textBody).toContain(nobodys.reference);
    expect(owners.textBody).toContain('nobody has it yet');

    // The next morning it comes again.
    expect((await sendMorningDigests(em(), { now: new Date('2026-12-05T13:31:00Z'), companyIds: [company.id] })).sent).toBe(2);
    // The scheduled job runs over every firm without failing (whatever the real clock says).
    await morningDigestJob.run({}, { em: em(), send: noSend });
  });
});

describe('triage scores as response targets pass', () => {
  test('an inquiry nobody contacted loses its response points once the target passes; a contacted one keeps them', async () => {
    const { company } = await buildFirm(em(), [{ name: 'Rui', role: 'owner' }]);
    const due = new Date(Date.now() - 60 * 60 * 1000);
    const tx = em();
    const waiting = buildLead(tx, company.id);
    waiting.responseDueAt = due;
    const answered = buildLead(tx, company.id);
    answered.responseDueAt = due;
    answered.firstContactAt = new Date(due.getTime() - 60_000);
    const before = new Date(due.getTime() - 60_000);
    await refreshTriageScore(tx, waiting, before);
    await refreshTriageScore(tx, answered, before);
    await tx.flush();
    const scores = async () =>
      (await em().find(Lead, { id: { $in: [waiting.id, answered.id] } })).map((l) => [l.id === waiting.id ? 'waiting' : 'answered', l.triageScore]);
    const [w0, a0] = [waiting.triageScore, answered.triageScore];

    // Other tests' rows in this database may change too; this test's own are checked below.
    expect((await refreshOverdueTriage(em())).changed).toBeGreaterThanOrEqual(1);
    // The default weights give "response so far" 25 of the 100 points (src/lib/estimate/schemas.ts).
    expect(Object.fromEntries(await scores())).toEqual({ waiting: w0 - 25, answered: a0 });
    // Run again (the scheduled job): nothing more changes.
    await overdueTriageJob.run({}, { em: em(), send: noSend });
    expect(Object.fromEntries(await scores())).toEqual({ waiting: w0 - 25, answered: a0 });
  });
});

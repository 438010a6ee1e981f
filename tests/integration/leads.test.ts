import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Company } from '../../src/lib/server/companies/company.entity';
import { config } from '../../src/lib/server/config';
import { issueFormToken } from '../../src/lib/server/embed/form-token';
import { InvalidInput } from '../../src/lib/server/errors';
import { Lead } from '../../src/lib/server/leads/lead.entity';
import { submitWidgetLead as submitLead } from '../../src/lib/server/embed/widget-lead';
import type { LeadRequestParsed as LeadRequest } from '../../src/lib/shared/lead-schemas';
import { OutboxMail } from '../../src/lib/server/mail/outbox-mail.entity';
import { createSmtpSender } from '../../src/lib/server/mail/transport';
import { leadRequestSchema } from '../../src/lib/shared/lead-schemas';
import { freeLoopbackPort } from '../helpers/ports';
import { mailTo, waitForMail } from '../helpers/mailbox';
import { deliverMatchingMail } from '../helpers/outbox';

let orm: MikroORM;
let cedar: Company;
let northgate: Company;

beforeAll(async () => {
  orm = await getOrm();
  cedar = await orm.em.fork().findOneOrFail(Company, { slug: 'cedar-hollow' });
  northgate = await orm.em.fork().findOneOrFail(Company, { slug: 'northgate' });
});
afterAll(async () => {
  await orm.close();
});

/** The error a call was refused with (the test fails if it was not refused). */
const refusalOf = (call: Promise<unknown>): Promise<InvalidInput> =>
  call.then(
    () => {
      throw new Error('expected a refusal');
    },
    (error: InvalidInput) => error,
  );

/** A submission as the widget sends it, from a form opened a minute ago. */
function submission(company: Company, overrides: Partial<LeadRequest['contact']> = {}, extra: Record<string, unknown> = {}): LeadRequest {
  const { token } = issueFormToken(company.id, Date.now() - 60_000);
  return leadRequestSchema.parse({
    formToken: token,
    idempotencyKey: randomUUID(),
    project: {
      rooms: [
        {
          name: 'Dining room',
          ceilingHeight: 96,
          length: 156,
          width: 132,
          walls: [{ side: 'length' }, { side: 'width', openings: [{ kind: 'door' }] }],
          treatment: { id: 'beadboard', height: 'wainscot' },
        },
      ],
      builtBefore1978: 'no',
      measuredBy: 'homeowner-tape',
    },
    contact: {
      name: 'Ada Greenleaf',
      email: `ada-${randomUUID().slice(0, 8)}@example.test`,
      phone: '(512) 555-0161',
      address: '27 Tanager St',
      postcode: '78704',
      preferredContact: 'email',
      consent: true,
      ...overrides,
    },
    ...extra,
  });
}

describe('sending a lead', () => {
  test('with the SMTP server down, the lead is stored and its e-mails wait in the outbox, then go out once it is back', async () => {
    const request = submission(cedar);
    const result = await submitLead(orm.em.fork(), cedar, request);
    expect(result.stored).toBe(true);
    expect(result.viewUrl).toMatch(/\/estimate\/[0-9a-f-]{36}\?key=/);

    const em = orm.em.fork();
    const lead = await em.findOneOrFail(Lead, { company: cedar, idempotencyKey: request.idempotencyKey });
    expect(lead.phone).toBe('+15125550161');
    expect(lead.rangeLowCents).toBeLessThanOrEqual(lead.rangeHighCents);
    const queued = await em.find(OutboxMail, { company: cedar, subject: { $like: `%${lead.reference}%` } });
    // The firm's alert goes to every owner and salesperson who has not turned it off (the demo firm's
    // three people); the homeowner's confirmation carries the range.
    expect(queued.map((m) => m.toAddress).sort()).toEqual(['olive@cedar-hollow.test', 'rhea@cedar-hollow.test', 'sam@cedar-hollow.test']);

    // This lead's own mail: the firm's alerts and the homeowner's confirmation.
    const ownMail = { $or: [{ id: { $in: queued.map((m) => m.id) } }, { toAddress: request.contact.email }] };

    // SMTP down: a real SMTP client against a loopback port where nothing listens.
    const down = createSmtpSender(`smtp://127.0.0.1:${await freeLoopbackPort()}`);
    expect(await deliverMatchingMail(orm.em.fork(), ownMail, { send: down })).toMatchObject({ sent: 0, failed: queued.length + 1 });
    const waiting = await orm.em.fork().findOneOrFail(OutboxMail, { toAddress: request.contact.email });
    expect(waiting.status).toBe('queued');
    expect(await mailTo(request.contact.email)).toHaveLength(0);

    // Back up, and the retry is due: delivered exactly once.
    await orm.em.fork().nativeUpdate(OutboxMail, { toAddress: request.contact.email }, { nextAttemptAt: new Date(Date.now() - 1000) });
    await deliverMatchingMail(orm.em.fork(), ownMail);
    const mail = await waitForMail({ to: request.contact.email, subject: 'Your price estimate' });
    expect(mail.text).toContain(lead.reference);
    expect(await mailTo(request.contact.email)).toHaveLength(1);

    // In the firm's name, from our own sending address, with replies going to the firm.
    expect(mail.from.name).toBe(cedar.name);
    expect(config.mailFrom).toContain(`<${mail.from.address}>`);
    expect(cedar.contactEmail).toMatch(/@cedar-hollow\.test$/);
    expect(mail.replyTo).toBe(cedar.contactEmail);
    // The link to the estimate is in the first screen of text, before the rooms and cautions.
    const firstLines = mail.text.split('\n').slice(0, 6).join('\n');
    expect(firstLines).toMatch(new RegExp(`/estimate/${lead.id}\\?key=`));
    expect(mail.text).toContain(cedar.phone!);
  });

  test('the same idempotency key sent twice at once makes one lead and one answer', async () => {
    const request = submission(cedar);
    const [a, b] = await Promise.all([submitLead(orm.em.fork(), cedar, request), submitLead(orm.em.fork(), cedar, request)]);
    expect(a.reference).toBe(b.reference);
    expect(await orm.em.fork().count(Lead, { company: cedar, idempotencyKey: request.idempotencyKey })).toBe(1);
  });

  test('the same idempotency key with a different body is refused with 422, and the first lead stays as it was', async () => {
    // Source: IETF draft-ietf-httpapi-idempotency-key-header, section 2.7: reusing a key with a
    // different request payload is an error the server reports (422 Unprocessable Content).
    const first = submission(cedar);
    await submitLead(orm.em.fork(), cedar, first);
    const changed = { ...first, contact: { ...first.contact, name: 'Someone Else' } };
    const error = await refusalOf(submitLead(orm.em.fork(), cedar, changed));
    expect(error.status).toBe(422);
    expect(error.fields).toHaveProperty('idempotencyKey');
    const stored = await orm.em.fork().find(Lead, { company: cedar, idempotencyKey: first.idempotencyKey });
    expect(stored.map((lead) => lead.name)).toEqual(['Ada Greenleaf']);
    // The very same body again is still answered with the first lead.
    expect((await submitLead(orm.em.fork(), cedar, first)).reference).toBe(stored[0]!.reference);
  });

  test('a postcode outside the service area is refused on that field, politely', async () => {
    const error = await refusalOf(submitLead(orm.em.fork(), cedar, submission(cedar, { postcode: '10001' })));
    expect(error).toBeInstanceOf(InvalidInput);
    expect(error.fields?.['contact.postcode']).toMatch(/doesn't work in 10001 yet/);
  });

  test('a filled-in hidden field or a form sent within seconds of opening looks accepted but stores nothing', async () => {
    const bot = submission(cedar, {}, { website: 'http://spam.example' });
    expect((await submitLead(orm.em.fork(), cedar, bot)).stored).toBe(false);
    const { token } = issueFormToken(cedar.id);
    const hasty = { ...submission(cedar), formToken: token };
    expect((await submitLead(orm.em.fork(), cedar, hasty)).stored).toBe(false);
    const keys = [bot.idempotencyKey, hasty.idempotencyKey];
    expect(await orm.em.fork().count(Lead, { idempotencyKey: { $in: keys } })).toBe(0);
  });

  test('a form token of one firm is refused by another', async () => {
    const error = await refusalOf(submitLead(orm.em.fork(), northgate, submission(cedar)));
    expect(error).toBeInstanceOf(InvalidInput);
    expect(Object.keys(error.fields ?? {})).toEqual(['formToken']);
  });

  test('picture-frame moulding to the ceiling in a tall room can be sent (frame sides longer than the moulding are joined)', async () => {
    const request = submission(cedar);
    // 210 in ceiling: each of the two rows of frames is 96.375 in tall, longer than the 96 in moulding.
    request.project.rooms = [{ ...request.project.rooms[0]!, ceilingHeight: 210, treatment: { id: 'picture-frame', height: 'full' } }];
    const result = await submitLead(orm.em.fork(), cedar, request);
    expect(result.stored).toBe(true);
    expect(result.estimate!.notes.join(' ')).toMatch(/scarf joint/);
  });

  test('a treatment the firm does not offer is refused with a field path', async () => {
    const request = submission(northgate);
    request.project.rooms[0]!.treatment.id = 'picture-frame';
    request.contact.postcode = '02134';
    const error = await refusalOf(submitLead(orm.em.fork(), northgate, request));
    expect(error).toBeInstanceOf(InvalidInput);
    expect(Object.keys(error.fields ?? {})[0]).toMatch(/^project\.rooms\.0\.treatment/);
  });
});

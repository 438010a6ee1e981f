// The invented demo scenario: two firms on one installation, so tenant isolation shows.
// Only the start command seeds this; no production path imports it.
import type { EntityManager } from '@mikro-orm/postgresql';
import { Company } from '../companies/company.entity';
import { Membership, type Role } from '../users/membership.entity';
import { User } from '../users/user.entity';
import { hashPassword } from '../users/password';
import { RateBookVersion } from '../rates/rate-book-version.entity';
import { storedRateBook } from '../rates/stored-rate-book';
import { sampleRateBook, type RateBookInput } from '~/lib/estimate';
import { seedDemoLeads } from './demo-leads';
import { seedDemoPhotos } from './demo-photos';
import { seedDemoVisits } from './demo-visits';

export const DEMO_PASSWORD = 'lapwing-demo-2026';

type DemoFirm = {
  slug: string;
  name: string;
  timeZone: string;
  brandColor: string;
  phone: string;
  /** Where homeowners' replies go. */
  contactEmail: string;
  servicePostcodes: string[];
  notificationEmails: string[];
  people: { email: string; name: string; role: Role }[];
  /** The firm's published numbers: the invented sample rate book with the firm's own changes. */
  rates: (base: RateBookInput) => RateBookInput;
};

export const DEMO_FIRMS: DemoFirm[] = [
  {
    slug: 'cedar-hollow',
    name: 'Cedar Hollow Trim Co.',
    timeZone: 'America/Chicago',
    brandColor: '#7A4E2D',
    phone: '+1 512 555 0147',
    contactEmail: 'hello@cedar-hollow.test',
    servicePostcodes: ['786', '787'],
    notificationEmails: ['olive@cedar-hollow.test', 'sam@cedar-hollow.test'],
    rates: (base) => base,
    people: [
      { email: 'olive@cedar-hollow.test', name: 'Olive Marten', role: 'owner' },
      { email: 'sam@cedar-hollow.test', name: 'Sam Okafor', role: 'sales' },
      { email: 'rhea@cedar-hollow.test', name: 'Rhea Lindqvist', role: 'sales' },
    ],
  },
  {
    slug: 'northgate',
    name: 'Northgate Wallworks',
    timeZone: 'America/New_York',
    brandColor: '#1D4E89',
    phone: '+1 617 555 0123',
    contactEmail: 'office@northgate.test',
    servicePostcodes: ['021', '022'],
    notificationEmails: ['nora@northgate.test'],
    rates: (base) => ({
      ...base,
      labour: { ...base.labour, rateCents: 8_500 },
      minimumJobCents: 120_000,
      catalogue: { ...base.catalogue, treatments: base.catalogue.treatments.map((t) => (t.id === 'picture-frame' ? { ...t, enabled: false } : t)) },
    }),
    people: [{ email: 'nora@northgate.test', name: 'Nora Beaumont', role: 'owner' }],
  },
];

/** Adds whatever part of the demo scenario is missing; running it twice changes nothing. */
export async function seedDemo(em: EntityManager): Promise<string> {
  let created = 0;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  for (const firm of DEMO_FIRMS) {
    let company = await em.findOne(Company, { slug: firm.slug });
    if (!company) {
      company = em.create(Company, {
        slug: firm.slug,
        name: firm.name,
        timeZone: firm.timeZone,
        brandColor: firm.brandColor,
        phone: firm.phone,
        contactEmail: firm.contactEmail,
        servicePostcodes: firm.servicePostcodes,
        notificationEmails: firm.notificationEmails,
      });
      created++;
    } else if (!company.contactEmail) {
      // Databases seeded before firms had a contact address get one.
      company.contactEmail = firm.contactEmail;
    }
    for (const person of firm.people) {
      let user = await em.findOne(User, { email: person.email });
      if (!user) {
        user = em.create(User, { email: person.email, name: person.name, passwordHash });
        created++;
      }
      const membership = await em.findOne(Membership, { company, user });
      if (!membership) {
        em.create(Membership, { company, user, role: person.role });
        created++;
      }
    }
  }
  await em.flush();

  for (const firm of DEMO_FIRMS) {
    const company = await em.findOneOrFail(Company, { slug: firm.slug });
    let published = await em.findOne(RateBookVersion, { company, status: 'published' });
    const rates = firm.rates(sampleRateBook());
    if (!published) {
      published = em.create(RateBookVersion, {
        company,
        number: 1,
        status: 'published',
        data: storedRateBook.wrap(rates),
        note: 'Starting rates',
        publishedAt: new Date(),
      });
      // A draft the owner is still working on: labour up five per cent.
      const draft = { ...rates, labour: { ...rates.labour, rateCents: Math.round(rates.labour.rateCents * 1.05) } };
      em.create(RateBookVersion, { company, number: 2, status: 'draft', data: storedRateBook.wrap(draft), note: 'Spring prices (draft)' });
      await em.flush();
      created += 2;
    }
    created += await seedDemoLeads(em, company, published, storedRateBook.read(published.data), firm.servicePostcodes);
    created += await seedDemoPhotos(em, company);
    created += await seedDemoVisits(em, company, published, storedRateBook.read(published.data));
  }
  return created ? `${created} rows added` : 'already present';
}

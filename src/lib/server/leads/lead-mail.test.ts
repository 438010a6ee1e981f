import { describe, expect, it } from 'vitest';
import { estimate, sampleRateBook } from '~/lib/estimate';
import type { Company } from '../companies/company.entity';
import { presentForHomeowner } from '../estimates/present-estimate';
import { firmReplyTo, homeownerConfirmation } from './lead-mail';

const company = {
  name: 'Cedar Hollow Trim & Co.',
  phone: '+1 512 555 0147',
  contactEmail: 'hello@cedar-hollow.test',
  notificationEmails: ['olive@cedar-hollow.test'],
} as Company;
const lead = {
  reference: 'L-7K3Q',
  name: 'Dana <Whitfield>',
  email: 'dana@example.test',
  phone: '+1 512 555 0100',
  address: '418 Larkspur Ct',
  postcode: '78701',
  preferredContact: 'phone',
  message: null,
};
// Built before 1978, so the lead-paint caution is among the cautions.
const view = presentForHomeowner(
  estimate(
    {
      rooms: [{ name: 'Dining room', ceilingHeight: 96, walls: [{ length: 156 }, { length: 138 }], treatment: { id: 'beadboard', height: 'wainscot' } }],
      builtBefore1978: 'yes',
      measuredBy: 'homeowner-tape',
    },
    sampleRateBook(),
  ),
);
const viewUrl = 'https://lapwing.test/estimate/0c1d?key=abc&x=1';
const mail = homeownerConfirmation(company, lead, view, viewUrl);

const ENTITIES: Record<string, string> = { '&amp;': '&', '&lt;': '<', '&gt;': '>', '&quot;': '"', '&#39;': "'" };
/** What a reader of the HTML version sees, with each link written as "label: address" as the text version does. */
function htmlAsWords(html: string): string[] {
  const decode = (s: string) => s.replace(/&(amp|lt|gt|quot|#39);/g, (e) => ENTITIES[e]!);
  const text = html
    .replace(/<a href="([^"]*)"[^>]*>([^<]*)<\/a>/g, (_, href: string, label: string) => `${label}: ${href}`)
    .replace(/<h3>([^<]*)<\/h3>/g, '$1: ')
    .replace(/<\/?strong>/g, '')
    .replace(/<[^>]+>/g, ' ');
  return decode(text).split(/\s+/).filter(Boolean);
}
const textAsWords = (text: string) => text.replace(/^- /gm, '').split(/\s+/).filter(Boolean);

describe("the homeowner's confirmation", () => {
  it('says the same things in its HTML and text versions, sign-off included', () => {
    expect(view.cautions.length).toBeGreaterThan(0);
    expect(htmlAsWords(mail.html)).toEqual(textAsWords(mail.text));
    expect(mail.text.trimEnd().endsWith(`— ${company.name}, ${company.phone}`)).toBe(true);
  });

  it('links to the estimate in its first lines', () => {
    const firstLines = mail.text.split('\n').slice(0, 6).join('\n');
    expect(firstLines).toContain(viewUrl);
    expect(firstLines).toContain(view.range.text);
  });

  it('names the cautions in short and links to their full text', () => {
    for (const caution of view.cautions) {
      expect(mail.text).toContain(`- ${caution.title}\n`);
      expect(mail.text).not.toContain(caution.text);
    }
    expect(mail.text).toContain(`${viewUrl}#cautions`);
  });

  it("gives the firm's phone number and escapes what the homeowner typed", () => {
    expect(mail.text).toContain('or call on +1 512 555 0147');
    expect(mail.html).toContain('Dana &lt;Whitfield&gt;');
    expect(mail.html).not.toContain('<Whitfield>');
  });

  it("sends replies to the firm's contact address, else to the first person told of leads", () => {
    expect(firmReplyTo(company)).toBe('hello@cedar-hollow.test');
    expect(firmReplyTo({ ...company, contactEmail: null } as Company)).toBe('olive@cedar-hollow.test');
  });
});

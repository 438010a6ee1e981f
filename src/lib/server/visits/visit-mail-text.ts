/**
 * The words of a visit's e-mails (invitation, change, cancellation, reminder) for the homeowner and
 * for the salesperson. Pure: the caller passes the facts and the links. Each message is written
 * once as paragraphs and rendered both as text and as HTML, so the two cannot say different things.
 */
import { formatInZone } from '~/lib/shared/time';
import { aboutHowLong } from '~/lib/shared/homeowner-visit';
import { escapeHtml } from '../leads/lead-mail';

export type VisitMailFacts = {
  firm: { name: string; phone: string | null; timeZone: string };
  homeowner: { name: string; phone: string; email: string };
  /** Street address and postcode of the job, as one line. */
  place: string;
  /** Who goes; null when the salesperson has left the firm. */
  salespersonName: string | null;
  start: Date;
  end: Date;
  /** The homeowner's own link to move or cancel. */
  homeownerLink: string;
  /** The inquiry in the staff area. */
  staffLink: string;
};

export type VisitMailKind = 'booked' | 'moved' | 'cancelled' | 'reminder' | 'handed-over';

type Part = string | { strong: string } | { link: string; href: string };
type Paragraph = Part[];

function textOf(paragraphs: Paragraph[]): string {
  return paragraphs
    .map((p) => p.map((part) => (typeof part === 'string' ? part : 'strong' in part ? part.strong : `${part.link}: ${part.href}`)).join(''))
    .join('\n\n');
}

function htmlOf(paragraphs: Paragraph[]): string {
  const body = paragraphs
    .map(
      (p) =>
        `<p>${p
          .map((part) =>
            typeof part === 'string'
              ? escapeHtml(part)
              : 'strong' in part
                ? `<strong>${escapeHtml(part.strong)}</strong>`
                : `<a href="${escapeHtml(part.href)}" style="color:#2F6B4F">${escapeHtml(part.link)}</a>`,
          )
          .join('')}</p>`,
    )
    .join('\n');
  return `<div style="font-family:'DM Sans',Arial,sans-serif;color:#1F2A2E;max-width:560px">\n${body}\n</div>`;
}

export type VisitMail = { subject: string; text: string; html: string; calendarDescription: string };

function mail(subject: string, paragraphs: Paragraph[], calendar: Paragraph[]): VisitMail {
  return { subject, text: textOf(paragraphs), html: htmlOf(paragraphs), calendarDescription: textOf(calendar) };
}

/** `Mon, Mar 9, 2026, 10:00 AM EDT`: read away from the app, so the zone is named. */
export function visitWhen(facts: Pick<VisitMailFacts, 'firm' | 'start'>): string {
  return formatInZone(facts.start, facts.firm.timeZone, 'dateTimeZone');
}

function firmPhone(facts: VisitMailFacts): Part[] {
  return facts.firm.phone ? [' or call ', { strong: facts.firm.phone }] : [];
}

/** What the homeowner gets: the time on the firm's clock, who comes, where, what to expect, their link. */
export function homeownerVisitMail(kind: Exclude<VisitMailKind, 'handed-over'>, facts: VisitMailFacts): VisitMail {
  const when = visitWhen(facts);
  const who = facts.salespersonName ? `${facts.salespersonName} from ${facts.firm.name}` : `Someone from ${facts.firm.name}`;
  const hello: Paragraph = [`Hello ${facts.homeowner.name},`];
  const sign: Paragraph = [`— ${facts.firm.name}${facts.firm.phone ? `, ${facts.firm.phone}` : ''}`];
  if (kind === 'cancelled') {
    const paragraphs: Paragraph[] = [
      hello,
      ['Your site visit on ', { strong: when }, ` at ${facts.place} is cancelled. Nobody will come.`],
      ['To find another time, reply to this e-mail', ...firmPhone(facts), '.'],
      sign,
    ];
    return mail(`Your site visit with ${facts.firm.name} is cancelled (was ${when})`, paragraphs, [
      [`Cancelled. To find another time, contact ${facts.firm.name}${facts.firm.phone ? ` on ${facts.firm.phone}` : ''}.`],
    ]);
  }
  const opening: Record<typeof kind, Paragraph> = {
    booked: [`${who} will come to measure your walls on `, { strong: when }, '.'],
    moved: ['Your site visit has a new time: ', { strong: when }, `. ${who} will come then.`],
    reminder: ['A reminder of your site visit: ', { strong: when }, `. ${who} will come to measure your walls.`],
  };
  const expect: Paragraph = [
    `The visit takes ${aboutHowLong(facts.start, facts.end)}. Someone needs to be home to let us in and show the rooms. `,
    'If it is easy, clear the bottom of the walls (boxes, small furniture) so each wall can be measured end to end.',
  ];
  const change: Paragraph = ['Need another time, or cannot make it? ', { link: 'Move or cancel your visit', href: facts.homeownerLink }];
  const paragraphs: Paragraph[] = [
    hello,
    opening[kind],
    ['Where: ', facts.place],
    expect,
    change,
    ...(kind === 'reminder' ? [] : [['The attached calendar file (visit.ics) adds the visit to your calendar.'] as Paragraph]),
    ['Questions? Reply to this e-mail', ...firmPhone(facts), '.'],
    sign,
  ];
  const subjects: Record<typeof kind, string> = {
    booked: `Your site visit with ${facts.firm.name}: ${when}`,
    moved: `Your site visit with ${facts.firm.name} has moved to ${when}`,
    reminder: `Reminder: your site visit with ${facts.firm.name}, ${when}`,
  };
  return mail(subjects[kind], paragraphs, [
    [`${who} comes to measure your walls. The visit takes ${aboutHowLong(facts.start, facts.end)}; someone needs to be home.`],
    [`Move or cancel: ${facts.homeownerLink}`],
    ...(facts.firm.phone ? [[`${facts.firm.name}: ${facts.firm.phone}`]] : []),
  ]);
}

/** What the salesperson gets: whose visit, when, where, how to reach the homeowner, the inquiry. */
export function salespersonVisitMail(kind: VisitMailKind, facts: VisitMailFacts, extra: { byHomeowner?: boolean } = {}): VisitMail {
  const when = visitWhen(facts);
  const headline: Record<VisitMailKind, Paragraph> = {
    booked: ['Site visit booked: ', { strong: when }, '.'],
    moved: [extra.byHomeowner ? 'The homeowner moved their site visit to ' : 'Site visit moved to ', { strong: when }, '.'],
    cancelled: [extra.byHomeowner ? 'The homeowner cancelled their site visit on ' : 'Site visit cancelled: ', { strong: when }, '. Your time is free again.'],
    reminder: ['Tomorrow or soon: site visit on ', { strong: when }, '.'],
    'handed-over': ['The site visit on ', { strong: when }, ' has gone to someone else on your team. Your time is free again.'],
  };
  const paragraphs: Paragraph[] = [
    headline[kind],
    [`${facts.homeowner.name} · ${facts.homeowner.phone} · ${facts.homeowner.email}`],
    ['Where: ', facts.place],
    [{ link: 'Open the inquiry', href: facts.staffLink }],
  ];
  const subjects: Record<VisitMailKind, string> = {
    booked: `Site visit booked: ${facts.homeowner.name}, ${when}`,
    moved: `Site visit moved: ${facts.homeowner.name}, ${when}`,
    cancelled: `Site visit cancelled: ${facts.homeowner.name}, was ${when}`,
    reminder: `Reminder: site visit with ${facts.homeowner.name}, ${when}`,
    'handed-over': `Site visit handed over: ${facts.homeowner.name}, ${when}`,
  };
  return mail(subjects[kind], paragraphs, [[`${facts.homeowner.name}, ${facts.homeowner.phone}`], [`Inquiry: ${facts.staffLink}`]]);
}

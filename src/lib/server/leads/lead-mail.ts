import type { Company } from '../companies/company.entity';
import type { HomeownerEstimate } from '../estimates/present-estimate';
import { formatMoney } from '~/lib/estimate';
import { describeRoomChoice, type RoomChoice } from './room-choices';

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
/** Everything a homeowner typed is escaped before it goes into HTML mail. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ESCAPES[c]!);
}

type LeadFacts = {
  reference: string;
  name: string;
  email: string;
  phone: string;
  address: string;
  postcode: string;
  preferredContact: string;
  message: string | null;
};

/** Where a homeowner's reply should land: the firm's contact address, else the first person told of leads. */
export function firmReplyTo(company: Company): string | undefined {
  return company.contactEmail ?? company.notificationEmails[0];
}

/**
 * One paragraph of the confirmation, written once and rendered both as text and as HTML, so the
 * two versions cannot say different things. Parts are plain text, strong text or a link.
 */
type Part = string | { strong: string } | { link: string; href: string };
type Block = { kind: 'p' | 'big' | 'quiet'; parts: Part[] } | { kind: 'list'; heading: string; items: Part[][] };

function partText(part: Part): string {
  if (typeof part === 'string') return part;
  if ('strong' in part) return part.strong;
  return `${part.link}: ${part.href}`;
}

function partHtml(part: Part): string {
  if (typeof part === 'string') return escapeHtml(part);
  if ('strong' in part) return `<strong>${escapeHtml(part.strong)}</strong>`;
  return `<a href="${escapeHtml(part.href)}" style="color:#2F6B4F">${escapeHtml(part.link)}</a>`;
}

function renderText(blocks: Block[]): string {
  return blocks
    .map((b) =>
      b.kind === 'list' ? [`${b.heading}:`, ...b.items.map((item) => `- ${item.map(partText).join('')}`)].join('\n') : b.parts.map(partText).join(''),
    )
    .join('\n\n');
}

function renderHtml(blocks: Block[]): string {
  const style = { p: '', big: ' style="font-size:24px;font-weight:700;margin:8px 0"', quiet: ' style="color:#5B6B73"' };
  const body = blocks
    .map((b) =>
      b.kind === 'list'
        ? `<h3>${escapeHtml(b.heading)}</h3><ul>${b.items.map((item) => `<li>${item.map(partHtml).join('')}</li>`).join('')}</ul>`
        : `<p${style[b.kind]}>${b.parts.map(partHtml).join('')}</p>`,
    )
    .join('\n');
  return `<div style="font-family:'DM Sans',Arial,sans-serif;color:#1F2A2E;max-width:560px">\n${body}\n</div>`;
}

/**
 * The homeowner's confirmation, in the firm's name: the link to the estimate first, then the range,
 * the rooms, how it adds up, the cautions in short (the full text is behind the link), and how to
 * reach the firm.
 */
export function homeownerConfirmation(company: Company, lead: LeadFacts, view: HomeownerEstimate, viewUrl: string, choices?: RoomChoice[]) {
  const money = (cents: number) => formatMoney(cents, view.currency, view.locale, { wholeUnits: true });
  const phone: Part[] = company.phone ? [' on ', { strong: company.phone }] : [];
  const blocks: Block[] = [
    { kind: 'p', parts: [`Hello ${lead.name},`] },
    { kind: 'p', parts: [`Thank you for asking ${company.name} about your walls. Your price range is ${view.range.text}.`] },
    { kind: 'p', parts: [{ link: 'See your estimate, with drawings of each wall', href: viewUrl }] },
    { kind: 'quiet', parts: [view.rangeReason] },
    {
      kind: 'list',
      heading: 'Your rooms',
      // Per room as it was asked (finish, height, walls, accent wall) when the choices are known.
      items: choices
        ? choices.map((c) => [describeRoomChoice(c)])
        : view.rooms.map((r) => [
            `${r.name}: ${r.treatmentName}, ${r.height === 'full' ? 'full height' : 'wainscot height'}, about ${Math.round(r.netSqFt)} sq ft`,
          ]),
    },
    { kind: 'list', heading: 'How the middle of the range adds up', items: view.groups.map((g) => [`${g.label}: about ${money(g.cents)}`]) },
    ...(view.cautions.length
      ? [
          { kind: 'list' as const, heading: 'Good to know before the work starts', items: view.cautions.map((c) => [c.title]) },
          { kind: 'p' as const, parts: [{ link: 'Read what each of these means', href: `${viewUrl}#cautions` }] },
        ]
      : []),
    {
      kind: 'p',
      parts: [`${company.name} will be in touch by ${lead.preferredContact} to arrange a site visit. Your reference is `, { strong: lead.reference }, '.'],
    },
    { kind: 'p', parts: [`Questions? Reply to this e-mail`, ...(company.phone ? [' or call', ...phone] : []), '.'] },
    { kind: 'p', parts: [`— ${company.name}`, ...(company.phone ? [`, ${company.phone}`] : [])] },
  ];
  return { subject: `Your price estimate from ${company.name}: ${view.range.text}`, text: renderText(blocks), html: renderHtml(blocks) };
}

/** The firm's new-lead alert, linking to the lead in the staff area. */
export function newLeadAlert(company: Company, lead: LeadFacts, view: HomeownerEstimate, staffUrl: string, photoCount: number, choices?: RoomChoice[]) {
  const rooms = choices ? choices.map(describeRoomChoice) : view.rooms.map((r) => `${r.name} (${r.treatmentName})`);
  const text = [
    `New inquiry ${lead.reference} for ${company.name}: ${view.range.text}.`,
    '',
    `${lead.name} · ${lead.phone} · ${lead.email}`,
    `${lead.address}, ${lead.postcode}`,
    `Prefers: ${lead.preferredContact}`,
    'Rooms:',
    ...rooms.map((r) => `- ${r}`),
    `Photos: ${photoCount}`,
    ...(lead.message ? ['', `Note: ${lead.message}`] : []),
    '',
    `Open the lead: ${staffUrl}`,
  ].join('\n');
  const html = `<div style="font-family:'DM Sans',Arial,sans-serif;color:#1F2A2E">
<p><strong>New inquiry ${escapeHtml(lead.reference)}</strong>: ${escapeHtml(view.range.text)}</p>
<p>${escapeHtml(lead.name)} · ${escapeHtml(lead.phone)} · ${escapeHtml(lead.email)}<br>${escapeHtml(lead.address)}, ${escapeHtml(lead.postcode)}<br>Prefers: ${escapeHtml(lead.preferredContact)}</p>
<p>Rooms:</p><ul>${rooms.map((r) => `<li>${escapeHtml(r)}</li>`).join('')}</ul>
<p>Photos: ${photoCount}</p>
${lead.message ? `<p>Note: ${escapeHtml(lead.message)}</p>` : ''}
<p><a href="${escapeHtml(staffUrl)}" style="color:#2F6B4F">Open the lead</a></p>
</div>`;
  return { subject: `New inquiry ${lead.reference}: ${lead.name}, ${view.range.text}`, text, html };
}

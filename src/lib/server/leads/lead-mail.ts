import type { Company } from '../companies/company.entity';
import type { HomeownerEstimate } from '../estimates/present-estimate';
import { formatMoney } from '~/lib/estimate';

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

function cautionLines(view: HomeownerEstimate): string[] {
  return view.cautions.map((c) => `- ${c.title}: ${c.text}`);
}

/** The homeowner's confirmation: the range, how it adds up, cautions, and a private link. */
export function homeownerConfirmation(company: Company, lead: LeadFacts, view: HomeownerEstimate, viewUrl: string) {
  const money = (cents: number) => formatMoney(cents, view.currency, view.locale, { wholeUnits: true });
  const rooms = view.rooms.map(
    (r) => `- ${r.name}: ${r.treatmentName}, ${r.height === 'full' ? 'full height' : 'wainscot height'}, about ${Math.round(r.netSqFt)} sq ft`,
  );
  const groups = view.groups.map((g) => `- ${g.label}: about ${money(g.cents)}`);
  const text = [
    `Hello ${lead.name},`,
    '',
    `Thank you for asking ${company.name} about your walls. Your price range is ${view.range.text}.`,
    view.rangeReason,
    '',
    'Your rooms:',
    ...rooms,
    '',
    'How the middle of the range adds up:',
    ...groups,
    '',
    ...(view.cautions.length ? ['Good to know before the work starts:', ...cautionLines(view), ''] : []),
    `${company.name} will be in touch by ${lead.preferredContact} to arrange a site visit. Your reference is ${lead.reference}.`,
    '',
    `See your estimate again at any time: ${viewUrl}`,
    '',
    `— ${company.name}${company.phone ? `, ${company.phone}` : ''}`,
  ].join('\n');
  const html = `<div style="font-family:'DM Sans',Arial,sans-serif;color:#1F2A2E;max-width:560px">
<p>Hello ${escapeHtml(lead.name)},</p>
<p>Thank you for asking ${escapeHtml(company.name)} about your walls. Your price range is</p>
<p style="font-size:24px;font-weight:700;margin:8px 0">${escapeHtml(view.range.text)}</p>
<p style="color:#5B6B73">${escapeHtml(view.rangeReason)}</p>
<h3>Your rooms</h3><ul>${view.rooms.map((r) => `<li>${escapeHtml(r.name)}: ${escapeHtml(r.treatmentName)}, ${r.height === 'full' ? 'full height' : 'wainscot height'}, about ${Math.round(r.netSqFt)} sq ft</li>`).join('')}</ul>
<h3>How the middle of the range adds up</h3><ul>${view.groups.map((g) => `<li>${escapeHtml(g.label)}: about ${escapeHtml(money(g.cents))}</li>`).join('')}</ul>
${view.cautions.length ? `<h3>Good to know before the work starts</h3><ul>${view.cautions.map((c) => `<li><strong>${escapeHtml(c.title)}.</strong> ${escapeHtml(c.text)}</li>`).join('')}</ul>` : ''}
<p>${escapeHtml(company.name)} will be in touch by ${escapeHtml(lead.preferredContact)} to arrange a site visit. Your reference is <strong>${escapeHtml(lead.reference)}</strong>.</p>
<p><a href="${escapeHtml(viewUrl)}" style="color:#2F6B4F">See your estimate again</a></p>
</div>`;
  return { subject: `Your price estimate from ${company.name}: ${view.range.text}`, text, html };
}

/** The firm's new-lead alert, linking to the lead in the staff area. */
export function newLeadAlert(company: Company, lead: LeadFacts, view: HomeownerEstimate, staffUrl: string, photoCount: number) {
  const text = [
    `New inquiry ${lead.reference} for ${company.name}: ${view.range.text}.`,
    '',
    `${lead.name} · ${lead.phone} · ${lead.email}`,
    `${lead.address}, ${lead.postcode}`,
    `Prefers: ${lead.preferredContact}`,
    `Rooms: ${view.rooms.map((r) => `${r.name} (${r.treatmentName})`).join(', ')}`,
    `Photos: ${photoCount}`,
    ...(lead.message ? ['', `Note: ${lead.message}`] : []),
    '',
    `Open the lead: ${staffUrl}`,
  ].join('\n');
  const html = `<div style="font-family:'DM Sans',Arial,sans-serif;color:#1F2A2E">
<p><strong>New inquiry ${escapeHtml(lead.reference)}</strong>: ${escapeHtml(view.range.text)}</p>
<p>${escapeHtml(lead.name)} · ${escapeHtml(lead.phone)} · ${escapeHtml(lead.email)}<br>${escapeHtml(lead.address)}, ${escapeHtml(lead.postcode)}<br>Prefers: ${escapeHtml(lead.preferredContact)}</p>
<p>Rooms: ${escapeHtml(view.rooms.map((r) => `${r.name} (${r.treatmentName})`).join(', '))} · Photos: ${photoCount}</p>
${lead.message ? `<p>Note: ${escapeHtml(lead.message)}</p>` : ''}
<p><a href="${escapeHtml(staffUrl)}" style="color:#2F6B4F">Open the lead</a></p>
</div>`;
  return { subject: `New inquiry ${lead.reference}: ${lead.name}, ${view.range.text}`, text, html };
}

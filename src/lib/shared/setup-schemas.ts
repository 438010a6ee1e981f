/**
 * Inputs of Setup's pages (firm profile, service area, notifications, the widget's allowed sites),
 * shared by each page's island (react-hook-form resolver) and its PUT route, so the message beside a
 * field is the message the server gives.
 */
import { z } from 'zod';
import { AA_TEXT_CONTRAST, brandTextContrast, formatRatio } from './contrast';
import { parsePhoneNumberFromString } from 'libphonenumber-js/min';
import { DEFAULT_PHONE_COUNTRY } from './lead-schemas';
import { isTimeZone } from './time';

/** `Area/Location` names of the IANA tz database (and UTC); "EST" or "+05:00" are not zones a firm keeps. */
const ZONE_SHAPE = /^(UTC|[A-Za-z_]+(\/[A-Za-z0-9_+-]+)+)$/;

/**
 * Whether `name` is an IANA time zone: one this runtime lists (`Intl.supportedValuesOf('timeZone')`)
 * or an alias of one it knows (Node's list has `Asia/Calcutta`, a browser's may have `Asia/Kolkata`).
 */
export function isKnownZone(name: string): boolean {
  if (typeof name !== 'string' || !ZONE_SHAPE.test(name)) return false;
  return supportedZones().has(name) || isTimeZone(name);
}

let zones: Set<string> | undefined;
function supportedZones(): Set<string> {
  zones ??= new Set(typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : []);
  return zones;
}

export const UNKNOWN_ZONE = 'Unknown time zone. Use a name from the list, like America/Chicago.';

/** An optional text field: blank means "none" (null). */
const optionalText = (label: string, max: number) =>
  z
    .string({ error: `${label} must be text.` })
    .trim()
    .max(max, { error: `${label} must be at most ${max} characters.` })
    .transform((value) => (value === '' ? null : value));

/** #RRGGBB with a text colour (white or our ink) that reaches WCAG 2.2 AA on it. */
export const brandColorSchema = z
  .string({ error: 'Choose a colour.' })
  .trim()
  .regex(/^#[0-9A-Fa-f]{6}$/, { error: 'Use a colour written like #2F6B4F.' })
  .transform((value) => value.toUpperCase())
  .superRefine((value, ctx) => {
    const best = brandTextContrast(value);
    if (best && best.ratio < AA_TEXT_CONTRAST) {
      ctx.addIssue({ code: 'custom', message: brandContrastMessage(best.ratio) });
    }
  });

export function brandContrastMessage(ratio: number): string {
  return `Button text on this colour reaches only ${formatRatio(ratio)}, in white or in dark ink; it needs 4.5:1. Choose a darker or a lighter shade.`;
}

/** A US ZIP (five digits, optionally +4) or another country's postcode, upper-cased and trimmed. */
const postcodeText = z
  .string({ error: 'Give a ZIP or postcode.' })
  .trim()
  .toUpperCase()
  .regex(/^[A-Z0-9][A-Z0-9 -]{1,10}$/, { error: 'Enter a ZIP or postcode, like 78704.' });

/** Body of PUT /api/app/settings/profile. Currency and units are the Rate book's, not here. */
export const firmProfileSchema = z.strictObject({
  name: z
    .string({ error: 'Give the firm’s name.' })
    .trim()
    .min(1, { error: 'Give the firm’s name.' })
    .max(120, { error: 'The name must be at most 120 characters.' }),
  phone: optionalText('Phone', 30).transform((value, ctx) => {
    if (value === null) return null;
    // Kept in international format (+1 512 555 0147): homeowners read it as it is stored.
    const parsed = parsePhoneNumberFromString(value, DEFAULT_PHONE_COUNTRY);
    if (!parsed?.isValid()) {
      ctx.addIssue({ code: 'custom', message: 'Enter a phone number homeowners can call, like (512) 555-0147.' });
      return z.NEVER;
    }
    return parsed.formatInternational();
  }),
  contactEmail: optionalText('E-mail', 254)
    .transform((value) => value?.toLowerCase() ?? null)
    .pipe(z.email({ error: 'Enter an e-mail address like office@example.com.' }).nullable()),
  website: optionalText('Website', 200).refine((value) => value === null || isWebAddress(value), {
    error: 'Enter the full address of the site, like https://www.example.com.',
  }),
  addressStreet: optionalText('Street', 200),
  addressCity: optionalText('Town or city', 100),
  addressRegion: optionalText('State', 60),
  addressPostcode: z
    .string({ error: 'Give a ZIP or postcode.' })
    .trim()
    .transform((value) => (value === '' ? null : value))
    .pipe(postcodeText.nullable()),
  timeZone: z.string({ error: 'Choose a time zone.' }).trim().refine(isKnownZone, { error: UNKNOWN_ZONE }),
  brandColor: brandColorSchema,
});
export type FirmProfileInput = z.input<typeof firmProfileSchema>;
export type FirmProfile = z.output<typeof firmProfileSchema>;

function isWebAddress(value: string): boolean {
  try {
    const url = new URL(value);
    return (url.protocol === 'https:' || url.protocol === 'http:') && url.hostname.includes('.') && !url.username && !url.password;
  } catch (error) {
    if (error instanceof TypeError) return false;
    throw error;
  }
}

/**
 * The widget's allowed sites, each read as an origin: http or https, a host, an optional port, and
 * nothing after it (no path, query or fragment; RFC 6454 §4: an origin is scheme, host and port).
 * Returns the origin as `new URL().origin` writes it, or the reason it is not one.
 */
export function readOrigin(entry: string): { origin: string } | { problem: string } {
  const text = entry.trim();
  let url: URL;
  try {
    url = new URL(text);
  } catch (error) {
    if (error instanceof TypeError) return { problem: 'is not a web address; write it like https://www.example.com' };
    throw error;
  }
  if (url.protocol !== 'https:' && url.protocol !== 'http:') return { problem: 'must start with https:// (or http://)' };
  if (!url.hostname) return { problem: 'has no host name' };
  if (url.username || url.password) return { problem: 'must not carry a user name or password' };
  // `new URL('https://a.example')` and `…/` both have the path "/"; anything longer is a page, not a site.
  if (url.pathname !== '/' || url.search || url.hash || /[?#]/.test(text)) return { problem: 'must be the site only, with no path after the host' };
  return { origin: url.origin };
}

export const MAX_EMBED_ORIGINS = 20;

/** Body of PUT /api/app/settings/widget: the sites allowed to frame the widget and call its API. */
export const widgetSitesSchema = z.strictObject({
  embedOrigins: z
    .array(z.string({ error: 'Each site must be text.' }).max(300, { error: 'This address is too long.' }), { error: 'Give a list of sites.' })
    .max(MAX_EMBED_ORIGINS, { error: `At most ${MAX_EMBED_ORIGINS} sites.` })
    .transform((entries, ctx) => {
      const seen = new Map<string, number>();
      const origins: string[] = [];
      entries.forEach((entry, index) => {
        const read = readOrigin(entry);
        if ('problem' in read) {
          ctx.addIssue({ code: 'custom', path: [index], message: `“${entry.trim().slice(0, 80)}” ${read.problem}.` });
          return;
        }
        const earlier = seen.get(read.origin);
        if (earlier !== undefined) {
          ctx.addIssue({ code: 'custom', path: [index], message: `“${entry.trim().slice(0, 80)}” is the same site as entry ${earlier + 1}.` });
          return;
        }
        seen.set(read.origin, index);
        origins.push(read.origin);
      });
      return origins;
    }),
});
export type WidgetSitesInput = z.input<typeof widgetSitesSchema>;
export type WidgetSites = z.output<typeof widgetSitesSchema>;

/**
 * Largest service radius we offer: beyond a couple of hours' drive a firm does not visit for a
 * ballpark (Lapwing's own limit, not a trade figure).
 */
export const MAX_SERVICE_RADIUS_MILES = 250;

/** Body of PUT /api/app/settings/service-area: a list of postcodes (or their first characters), or a radius. */
export const serviceAreaSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({
      kind: z.literal('postcodes'),
      postcodes: z
        .array(
          z
            .string({ error: 'Each entry must be text.' })
            .trim()
            .toUpperCase()
            .regex(/^[A-Z0-9][A-Z0-9 -]{0,9}$/, { error: 'Use a ZIP or postcode, or its first characters, like 787.' }),
          { error: 'Give a list of postcodes.' },
        )
        .max(500, { error: 'At most 500 entries.' })
        .transform((codes) => [...new Set(codes)]),
    }),
    z.strictObject({
      kind: z.literal('radius'),
      radiusMiles: z
        .number({ error: 'Give the distance in miles.' })
        .int({ error: 'Use whole miles.' })
        .min(1, { error: 'At least 1 mile.' })
        .max(MAX_SERVICE_RADIUS_MILES, { error: `At most ${MAX_SERVICE_RADIUS_MILES} miles.` }),
    }),
  ],
  { error: 'Choose a list of postcodes or a distance from your office.' },
);
export type ServiceAreaInput = z.input<typeof serviceAreaSchema>;
export type ServiceArea = z.output<typeof serviceAreaSchema>;

/** A working week of 5 × 9 hours (the response clock's hours, `leads/response-due.ts`). */
export const MAX_RESPONSE_TARGET_MINUTES = 5 * 9 * 60;

/** Body of PUT /api/app/settings/notifications. */
export const notificationsSchema = z.strictObject({
  extraEmails: z
    .array(
      z
        .string({ error: 'Each address must be text.' })
        .trim()
        .toLowerCase()
        .max(254, { error: 'This address is too long.' })
        .pipe(z.email({ error: 'Enter an e-mail address like office@example.com.' })),
      { error: 'Give a list of addresses.' },
    )
    .max(20, { error: 'At most 20 addresses.' })
    .transform((emails) => [...new Set(emails)]),
  responseTargetMinutes: z
    .number({ error: 'Give the target in minutes.' })
    .int({ error: 'Use whole minutes.' })
    .min(15, { error: 'At least 15 minutes.' })
    .max(MAX_RESPONSE_TARGET_MINUTES, { error: 'At most a working week (2,700 minutes).' }),
});
export type NotificationsInput = z.input<typeof notificationsSchema>;
export type Notifications = z.output<typeof notificationsSchema>;

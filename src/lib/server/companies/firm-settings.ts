/**
 * Setup's settings of a firm, each read from and written to its `Company` row: the profile, the
 * service area, who hears of new inquiries and how soon they should be answered, and the sites
 * allowed to embed the widget. Inputs arrive checked by the shared schemas in `~/lib/shared/setup-schemas`.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import type { FirmProfile, Notifications, ServiceArea, WidgetSites } from '~/lib/shared/setup-schemas';
import { InvalidInput } from '../errors';
import { Company } from './company.entity';
import { postcodeCentroid } from './postcode-centroids';

async function companyOf(em: EntityManager, companyId: string): Promise<Company> {
  return em.findOneOrFail(Company, { id: companyId });
}

export function firmProfileOf(company: Company): FirmProfile {
  return {
    name: company.name,
    phone: company.phone,
    contactEmail: company.contactEmail,
    website: company.website,
    addressStreet: company.addressStreet,
    addressCity: company.addressCity,
    addressRegion: company.addressRegion,
    addressPostcode: company.addressPostcode,
    timeZone: company.timeZone,
    brandColor: company.brandColor,
  };
}

export async function saveFirmProfile(em: EntityManager, companyId: string, input: FirmProfile): Promise<FirmProfile> {
  const company = await companyOf(em, companyId);
  if (
    company.serviceRadiusMiles !== null &&
    input.addressPostcode !== company.addressPostcode &&
    !(input.addressPostcode && postcodeCentroid(input.addressPostcode))
  ) {
    // The radius is measured from this postcode; one we cannot place would leave the area without a centre.
    throw new InvalidInput('Some fields need attention.', {
      addressPostcode:
        'Your service area is a distance from this ZIP code, and we cannot place this one. Check it, or switch the service area to a list first.',
    });
  }
  Object.assign(company, input);
  await em.flush();
  return firmProfileOf(company);
}

export function serviceAreaOf(company: Company): ServiceArea {
  return company.serviceRadiusMiles === null
    ? { kind: 'postcodes', postcodes: company.servicePostcodes }
    : { kind: 'radius', radiusMiles: company.serviceRadiusMiles };
}

/** A radius needs a centre: the office's postcode from the profile, one whose centroid we ship. */
export async function saveServiceArea(em: EntityManager, companyId: string, input: ServiceArea): Promise<ServiceArea> {
  const company = await companyOf(em, companyId);
  if (input.kind === 'radius') {
    if (!company.addressPostcode) {
      throw new InvalidInput('Some fields need attention.', {
        radiusMiles: 'Add your office’s ZIP code to the firm profile first: the distance is measured from it.',
      });
    }
    if (!postcodeCentroid(company.addressPostcode)) {
      throw new InvalidInput('Some fields need attention.', {
        radiusMiles: `We cannot place your office’s ZIP code ${company.addressPostcode} on the map. Check it in the firm profile, or use a list of postcodes.`,
      });
    }
    company.serviceRadiusMiles = input.radiusMiles;
  } else {
    company.serviceRadiusMiles = null;
    company.servicePostcodes = input.postcodes;
  }
  await em.flush();
  return serviceAreaOf(company);
}

export function notificationsOf(company: Company): Notifications {
  return { extraEmails: company.notificationEmails, responseTargetMinutes: company.responseTargetMinutes };
}

/** Inquiries already stored keep the due time they were given; new ones follow the new target. */
export async function saveNotifications(em: EntityManager, companyId: string, input: Notifications): Promise<Notifications> {
  const company = await companyOf(em, companyId);
  company.notificationEmails = input.extraEmails;
  company.responseTargetMinutes = input.responseTargetMinutes;
  await em.flush();
  return notificationsOf(company);
}

export function widgetSitesOf(company: Company): WidgetSites {
  return { embedOrigins: company.embedOrigins };
}

/**
 * The embed page's `frame-ancestors` and the public API's CORS read this list from the row on every
 * request (no process keeps a copy), so a saved list applies to the next request in every process.
 */
export async function saveWidgetSites(em: EntityManager, companyId: string, input: WidgetSites): Promise<WidgetSites> {
  const company = await companyOf(em, companyId);
  company.embedOrigins = input.embedOrigins;
  await em.flush();
  return widgetSitesOf(company);
}

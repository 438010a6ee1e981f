/** The firm's visit rules and its time zone (Setup → Visits). */
import type { EntityManager } from '@mikro-orm/postgresql';
import type { FirmVisitSettings } from '~/lib/shared/visit-calendar';
import { Company } from '../companies/company.entity';

export function visitSettingsOf(company: Company): FirmVisitSettings {
  return {
    visitMinutes: company.visitMinutes,
    bufferMinutes: company.visitBufferMinutes,
    stepMinutes: company.visitStepMinutes,
    minNoticeMinutes: company.visitMinNoticeMinutes,
    horizonDays: company.visitHorizonDays,
    onlineBooking: company.onlineBooking,
    timeZone: company.timeZone,
  };
}

/**
 * Saves the settings (already checked by `firmVisitSettingsSchema`). Visits already booked keep
 * their times and their travel buffer; the new rules apply to the slots offered from now on.
 */
export async function saveVisitSettings(em: EntityManager, companyId: string, input: FirmVisitSettings): Promise<FirmVisitSettings> {
  const company = await em.findOneOrFail(Company, { id: companyId });
  Object.assign(company, {
    visitMinutes: input.visitMinutes,
    visitBufferMinutes: input.bufferMinutes,
    visitStepMinutes: input.stepMinutes,
    visitMinNoticeMinutes: input.minNoticeMinutes,
    visitHorizonDays: input.horizonDays,
    onlineBooking: input.onlineBooking,
    timeZone: input.timeZone,
  });
  await em.flush();
  return visitSettingsOf(company);
}

/** Visits: the pure scheduling core (no framework, no database). */
export { openSlots, SlotInputError, type OpenSlotsInput, type TimeRange } from './slots.ts';
export { visitCalendarFile, InvitationInputError, type VisitCalendarInput, type InvitationPerson } from './invitation.ts';
export { reminderDueAt, REMINDER_LOCAL_TIME } from './reminder-time.ts';

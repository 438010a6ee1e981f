/**
 * Humans take longer than this between opening the widget's form and sending it; scripts often
 * do not. An inquiry sent sooner is answered as usual but not stored. Kept apart from the
 * lead service so that browser tests can read it without loading the database entities.
 */
export const MIN_SECONDS_TO_SUBMIT = 4;

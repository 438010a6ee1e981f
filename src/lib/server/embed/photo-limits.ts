import { isId } from '~/lib/shared/ids';
import { NotFound } from '../errors';
import type { Limits } from './public-api';

/**
 * One budget for all of the widget's photo calls (request, complete, remove), shared because the
 * three routes use the same limiter name. Ten photos with a retry or two each use about 30; a
 * household or office behind one address gets room for several homeowners; a firm's form gets
 * room for many at once. Figures: common practice, no source.
 */
export const PHOTO_CALL_LIMITS: Limits = {
  perAddress: { points: 120, duration: 10 * 60 },
  perFirm: { points: 5000, duration: 10 * 60 },
  messages: { perAddress: 'Too many photo uploads from your network. Please wait a few minutes and try again.' },
};

/** The photo id from the URL; a malformed one is simply not found. */
export function photoIdOf(param: string | undefined): string {
  if (!isId(param)) throw new NotFound('This photo is not part of this form.');
  return param;
}

import { limiter } from '../rate-limit';

/**
 * One budget per network address for all of the widget's photo calls (request, complete, remove).
 * Ten photos with a retry or two each use about 30; a household or office behind one address gets
 * room for several homeowners. Figures: common practice, no source.
 */
const perAddress = limiter('widget-photos:address', { points: 120, duration: 10 * 60 });

export function limitPhotoCalls(clientAddress: string): Promise<void> {
  return perAddress.consume(clientAddress, 'Too many photo uploads from your network. Please wait a few minutes and try again.');
}

import type { MikroORM } from '@mikro-orm/postgresql';
import { deliverDueMail } from './outbox';
import { isUnavailable } from '../db/unavailable';
import { logger } from '../log';

const POLL_MS = 3_000;
let timer: NodeJS.Timeout | undefined;
let running: Promise<unknown> | undefined;
let orm: MikroORM | undefined;

function pass(): Promise<unknown> {
  if (!orm) return Promise.resolve();
  running ??= deliverDueMail(orm.em.fork())
    // During a database outage the next pass simply tries again; anything else is a fault to look at.
    .catch((error) =>
      isUnavailable(error) ? logger.warn({ err: error }, 'mail delivery pass skipped: database unavailable') : logger.error({ err: error }, 'mail delivery pass failed'),
    )
    .finally(() => {
      running = undefined;
    });
  return running;
}

/** Starts the background delivery loop of this process (once). Every process may run one. */
export function startMailWorker(appOrm: MikroORM): void {
  if (timer) return;
  orm = appOrm;
  timer = setInterval(pass, POLL_MS);
  timer.unref();
}

/** Asks for a delivery pass right away, after the caller's transaction has committed. */
export function kickMailDelivery(): void {
  setTimeout(pass, 10).unref();
}

import type { MikroORM } from '@mikro-orm/postgresql';
import { deliverDueMail } from './outbox';

const POLL_MS = 3_000;
let timer: NodeJS.Timeout | undefined;
let running: Promise<unknown> | undefined;
let orm: MikroORM | undefined;

function pass(): Promise<unknown> {
  if (!orm) return Promise.resolve();
  running ??= deliverDueMail(orm.em.fork())
    .catch((error) => console.error('mail delivery pass failed:', error))
    .finally(() => {
      running = undefined;
    });
  return running;
}

/** Starts the background delivery loop of this process (once). Every process may run one. */
export function startMailWorker(appOrm: MikroORM): void {
  if (timer) return;
  orm = appOrm;
  timer = setInterval(() => void pass(), POLL_MS);
  timer.unref();
}

/** Asks for a delivery pass right away, after the caller's transaction has committed. */
export function kickMailDelivery(): void {
  setTimeout(() => void pass(), 10).unref();
}

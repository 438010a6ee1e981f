/**
 * Work a request starts but does not wait for, so how long the answer takes cannot depend on it
 * (e.g. whether an e-mail address has an account). It runs on a later turn of the event loop, in
 * this process; a failure is logged. Anything that must survive a crash belongs in a table the work
 * writes to (such as the mail outbox), not here.
 */
import { currentLog } from './log';

const pending = new Set<Promise<void>>();

export function afterResponse(name: string, work: () => Promise<void>): void {
  const run: Promise<void> = new Promise<void>((resolve) => setImmediate(resolve))
    .then(work)
    .catch((error: unknown) => currentLog().error({ err: error }, `${name} (after the response) failed`))
    .finally(() => pending.delete(run));
  pending.add(run);
}

/** Resolves once all work started with afterResponse has finished (for tests and a clean stop). */
export async function afterResponseSettled(): Promise<void> {
  while (pending.size) await Promise.all([...pending]);
}

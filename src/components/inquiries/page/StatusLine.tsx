import type { FormStatus } from './api';

/** The line beside a staff form's button that announces how its last send went. */
export function StatusLine({ status }: { status: FormStatus }) {
  return (
    <p role="status" className={status?.kind === 'failed' ? 'text-sm text-brick' : 'text-sm text-lapwing'}>
      {status?.text}
    </p>
  );
}

// Every background job the app runs. Add a job here (see DEVELOPERS.md, "Background jobs").
import type { JobDefinition } from '../jobs/runner';
import { mailDeliveryJob } from '../mail/delivery-job';
import { abandonedPhotosJob } from '../photos/abandoned-photos';
import { followUpRemindersJob } from '../leads/follow-up-reminders';
import { purgeDeletedLeadsJob } from '../intake/purge-deleted-leads';
import { morningDigestJob } from '../intake/morning-digest';
import { overdueTriageJob } from '../leads/triage-refresh';
import { visitRemindersJob } from '../visits/visit-reminders';
import { rateBookReplayJob } from '../rate-preview/draft-preview';

// Each job has its own data type; the list holds them all.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export const backgroundJobs: readonly JobDefinition<any>[] = [
  mailDeliveryJob,
  abandonedPhotosJob,
  followUpRemindersJob,
  purgeDeletedLeadsJob,
  morningDigestJob,
  overdueTriageJob,
  visitRemindersJob,
  rateBookReplayJob,
];

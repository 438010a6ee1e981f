// Every background job the app runs. Add a job here (see DEVELOPERS.md, "Background jobs").
import type { JobDefinition } from '../jobs/runner';
import { mailDeliveryJob } from '../mail/delivery-job';
import { abandonedPhotosJob } from '../photos/abandoned-photos';

export const backgroundJobs: readonly JobDefinition<any>[] = [mailDeliveryJob, abandonedPhotosJob];

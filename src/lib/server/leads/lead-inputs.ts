import { projectSchema, type Project, type ProjectInput } from '~/lib/estimate';
import { versionedJson } from '../db/versioned-json';

/** The project exactly as the homeowner described it (after validation), as stored on a lead. */
export const leadInputs = versionedJson<Project, ProjectInput>({
  name: 'lead inputs',
  version: 1,
  schema: projectSchema,
  // Version 0: inputs stored before envelopes, already in the version-1 shape.
  upgrades: { 0: (data) => data },
});

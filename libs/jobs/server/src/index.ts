import type { EndpointDef } from '@latchwork/shared-server-kit';
import type { JobsDeps } from './jobs-deps';
import { customerEndpoints } from './customers/customer.endpoints';
import { jobEndpoints } from './jobs/job.endpoints';
import { surveyEndpoints } from './survey/survey.endpoints';
import { fileEndpoints } from './files/file.endpoints';

export type { JobsDeps } from './jobs-deps';
export * from './survey';

/** Customers, sites, jobs and their pipeline, site surveys and files. */
export function jobsEndpoints(deps: JobsDeps): EndpointDef[] {
  return [
    ...customerEndpoints(deps),
    ...jobEndpoints(deps),
    ...surveyEndpoints(deps),
    ...fileEndpoints(deps),
  ];
}

import type { EndpointDef } from '@latchwork/shared-server-kit';
import type { JobsDeps } from '../jobs-deps';

// Under construction in this session: the endpoints land here.
export function customerEndpoints(_deps: JobsDeps): EndpointDef[] {
  return [];
}

// Not an endpoint: the shared invalidation after a review step (status shows on the device list too).
import type { QueryClient } from '@tanstack/react-query';
import type { TeardownDto } from '@splitcase/contracts';
import { rootKeys, teardownScope } from '@/lib/query-keys';
import { teardownKey } from './get-teardown';

export function afterReviewStep(qc: QueryClient, t: TeardownDto) {
  qc.setQueryData(teardownKey(t.id), t);
  return Promise.all([qc.invalidateQueries({ queryKey: teardownScope(t.id) }), qc.invalidateQueries({ queryKey: rootKeys.devices })]);
}

import type { WalkerFixture } from './fixture';
import { customersWalk } from './customers';
import { jobsWalk } from './jobs';
import { surveyWalk } from './survey';
import { filesWalk } from './files';
import { stockWalk } from './stock';
import { purchasingWalk } from './purchasing';

export type { WalkerFixture, WalkerSetup } from './fixture';

/** Every feature's walker fixture; the walk runs them in this order. */
export const FEATURE_WALKS: WalkerFixture[] = [
  customersWalk,
  jobsWalk,
  surveyWalk,
  filesWalk,
  stockWalk,
  purchasingWalk,
];

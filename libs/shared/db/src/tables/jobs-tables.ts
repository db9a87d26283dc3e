import type { Generated } from 'kysely';
import type { CreatedAt, DateOnly, Defaulted, MinorUnits, Timestamp } from './column-types';

/** Stage ids as stored; @latchwork/jobs-domain's STAGES and the check constraint agree. */
export type JobStage =
  | 'enquiry'
  | 'survey_booked'
  | 'surveyed'
  | 'quoted'
  | 'won'
  | 'lost'
  | 'scheduled'
  | 'installing'
  | 'completed'
  | 'invoiced'
  | 'paid'
  | 'on_hold'
  | 'cancelled';

/** Jobs, the per-firm reference counter and the stage history (migration 2026_12_02_0100). */
export interface JobsTables {
  jobCounter: {
    tenantId: string;
    lastNumber: number;
  };
  job: {
    id: Generated<string>;
    tenantId: string;
    number: number;
    reference: string;
    title: string;
    customerId: string;
    siteId: string | null;
    valueEstimateMinor: MinorUnits | null;
    /** Where the enquiry came from: a referral, the website, a returning customer… */
    source: Defaulted<string>;
    ownerUserId: string | null;
    stage: Defaulted<JobStage>;
    stageChangedAt: Defaulted<Timestamp>;
    lostReason: string | null;
    enquiryOn: Defaulted<DateOnly>;
    surveyAt: Timestamp | null;
    quoteDueOn: DateOnly | null;
    installStartOn: DateOnly | null;
    installEndOn: DateOnly | null;
    createdBy: string | null;
    createdAt: CreatedAt;
    updatedAt: Defaulted<Timestamp>;
  };
  jobStageMove: {
    id: Generated<string>;
    tenantId: string;
    jobId: string;
    fromStage: JobStage | null;
    toStage: JobStage;
    reason: string | null;
    /** Set when a rule rather than a person moved the job (e.g. `quote-sent`). */
    rule: string | null;
    movedBy: string | null;
    movedAt: Defaulted<Timestamp>;
  };
}

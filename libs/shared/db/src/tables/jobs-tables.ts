import type { ColumnType, Generated } from 'kysely';
import type {
  CreatedAt,
  DateOnly,
  Defaulted,
  DefaultedDate,
  DefaultedTimestamp,
  MinorUnits,
  Timestamp,
} from './column-types';

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

/**
 * Jobs, the per-firm reference counter and the stage history (migration 2026_12_02_0100);
 * the timeline, notes and crew (2026_12_02_0120).
 */
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
    stageChangedAt: DefaultedTimestamp;
    lostReason: string | null;
    enquiryOn: DefaultedDate;
    surveyAt: Timestamp | null;
    quoteDueOn: DateOnly | null;
    installStartOn: DateOnly | null;
    installEndOn: DateOnly | null;
    createdBy: string | null;
    createdAt: CreatedAt;
    updatedAt: DefaultedTimestamp;
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
    movedAt: DefaultedTimestamp;
  };
  /** One line of a job's timeline; append-only. `kind` e.g. `stage-move`, `note`, `file-uploaded`. */
  jobEvent: {
    id: Generated<string>;
    tenantId: string;
    jobId: string;
    kind: string;
    summary: string;
    detail: ColumnType<Record<string, unknown>, Record<string, unknown> | undefined, never>;
    actorUserId: string | null;
    createdAt: CreatedAt;
  };
  jobNote: {
    id: Generated<string>;
    tenantId: string;
    jobId: string;
    authorUserId: string | null;
    body: string;
    /** User ids of the members the note mentions. */
    mentions: ColumnType<string[], string[] | undefined, never>;
    createdAt: CreatedAt;
  };
  /** Who is booked on a job; an installer sees only these jobs. */
  jobCrew: {
    tenantId: string;
    jobId: string;
    userId: string;
    createdAt: CreatedAt;
  };
}

import type { ColumnType, Generated } from 'kysely';
import type { CreatedAt, Defaulted, DefaultedTimestamp, Timestamp } from './column-types';

export type Substrate = 'concrete' | 'screed' | 'asphalt' | 'timber' | 'existing_floor';
export type StoredReadingKind =
  | 'relative_humidity'
  | 'moisture_emission'
  | 'surface_regularity'
  | 'air_temperature'
  | 'slab_temperature';
export type FileOwnerKind = 'job' | 'site' | 'customer';

/** A jsonb column written as JSON text and read back parsed. */
type Json<T> = ColumnType<T, string, string>;

/**
 * Site surveys, areas, takeoff versions, slab readings, the firm's slab limits, and file
 * links and thumbnails (migration 2026_12_02_0130).
 */
export interface SurveyTables {
  /** At most one per job. */
  survey: {
    id: Generated<string>;
    tenantId: string;
    jobId: string;
    substrate: Substrate | null;
    surveyedAt: Timestamp | null;
    surveyorUserId: string | null;
    notes: Defaulted<string>;
    createdAt: CreatedAt;
    updatedAt: DefaultedTimestamp;
  };
  surveyArea: {
    id: Generated<string>;
    tenantId: string;
    jobId: string;
    name: string;
    createdBy: string | null;
    createdAt: CreatedAt;
  };
  /** Immutable: the input, the rates used and the result without its plan. */
  takeoffVersion: {
    id: Generated<string>;
    tenantId: string;
    areaId: string;
    version: number;
    input: Json<Record<string, unknown>>;
    rates: Json<Record<string, unknown>>;
    summary: Json<Record<string, unknown>>;
    createdBy: string | null;
    createdAt: CreatedAt;
  };
  /** A reading with the verdict it got against the firm's limits when it was recorded. */
  slabReading: {
    id: Generated<string>;
    tenantId: string;
    jobId: string;
    kind: StoredReadingKind;
    method: string;
    value: number;
    unit: 'lb_per_1000ft2_24h' | 'g_per_m2_24h' | null;
    location: Defaulted<string>;
    takenAt: Timestamp;
    status: 'pass' | 'warn' | 'fail';
    message: string;
    source: string;
    recordedBy: string | null;
    createdAt: CreatedAt;
  };
  /** A firm's overrides of the slab limits, by reading kind. */
  surveySettings: {
    tenantId: string;
    slabLimits: Json<Record<string, unknown>>;
    updatedBy: string | null;
    updatedAt: DefaultedTimestamp;
  };
  fileLink: {
    id: Generated<string>;
    tenantId: string;
    fileId: string;
    ownerKind: FileOwnerKind;
    jobId: string | null;
    siteId: string | null;
    customerId: string | null;
    createdAt: CreatedAt;
  };
  fileThumbnail: {
    tenantId: string;
    fileId: string;
    objectKey: string;
    contentType: string;
    width: number;
    height: number;
    sizeBytes: ColumnType<string, number, never>;
  };
}

import type { ColumnType, Generated, Insertable, Selectable } from 'kysely';
import type { CreatedAt, Defaulted, Timestamp } from './tables/column-types';
import type { CustomersTables } from './tables/customers-tables';
import type { JobsTables } from './tables/jobs-tables';
import type { SurveyTables } from './tables/survey-tables';
import type { StockTables } from './tables/stock-tables';
import type { PurchasingTables } from './tables/purchasing-tables';

/** The role column's values; the database's check constraint and @latchwork/shared-access's ROLES agree. */
export type Role = 'owner' | 'estimator' | 'stores' | 'bookkeeper' | 'installer';

export type UnitSystem = 'metric' | 'imperial';
export type EmailStatus = 'queued' | 'sent' | 'failed';

/**
 * The whole schema as Kysely sees it (camelCase; the CamelCasePlugin maps to snake_case).
 * Global tables: tenant, appUser. Every other table carries tenantId and is guarded by
 * row-level security on `app.tenant_id` (see migrations). Each feature's tables are declared in
 * its own file under ./tables.
 */
export interface Database
  extends CustomersTables,
    JobsTables,
    SurveyTables,
    StockTables,
    PurchasingTables {
  tenant: {
    id: Generated<string>;
    slug: string;
    name: string;
    addressLines: ColumnType<string[], string[] | undefined, string[]>;
    currency: Defaulted<string>;
    units: Defaulted<UnitSystem>;
    /** Default tax rate in basis points (2000 = 20 %): integers, never floats. */
    defaultTaxRateBp: Defaulted<number>;
    paymentTermsDays: Defaulted<number>;
    numberPrefixes: Defaulted<Record<string, string>>;
    /** Overrides of the takeoff engine's default rates, by rate name. */
    takeoffRates: Defaulted<Record<string, unknown>>;
    createdAt: CreatedAt;
  };
  appUser: {
    id: Generated<string>;
    email: string;
    name: string;
    createdAt: CreatedAt;
  };
  membership: {
    tenantId: string;
    userId: string;
    role: Role;
    createdAt: CreatedAt;
    invitedBy: string | null;
    /** Null until the invited person first signs in to this firm. */
    joinedAt: Timestamp | null;
  };
  appSession: {
    sid: string;
    sess: unknown;
    expire: Timestamp;
  };
  auditLog: {
    id: Generated<string>;
    tenantId: string;
    userId: string | null;
    action: string;
    subject: string | null;
    detail: ColumnType<unknown, Record<string, unknown> | undefined, never>;
    ipAddress: string | null;
    createdAt: CreatedAt;
  };
  file: {
    id: Generated<string>;
    tenantId: string;
    objectKey: string;
    fileName: string;
    contentType: string;
    sizeBytes: ColumnType<string, number | bigint, never>;
    uploadedBy: string | null;
    createdAt: CreatedAt;
  };
  emailLog: {
    id: Generated<string>;
    tenantId: string;
    toAddress: string;
    subject: string;
    template: string;
    status: EmailStatus;
    messageId: string | null;
    error: string | null;
    attempts: ColumnType<number, number | undefined, number>;
    createdAt: CreatedAt;
    sentAt: Timestamp | null;
  };
}

export type Tenant = Selectable<Database['tenant']>;
export type NewTenant = Insertable<Database['tenant']>;
export type AppUser = Selectable<Database['appUser']>;
export type NewAppUser = Insertable<Database['appUser']>;
export type Membership = Selectable<Database['membership']>;
export type AuditEntry = Selectable<Database['auditLog']>;
export type EmailLogEntry = Selectable<Database['emailLog']>;

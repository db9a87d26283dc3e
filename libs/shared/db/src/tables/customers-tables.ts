import type { Generated } from 'kysely';
import type { CreatedAt, Defaulted, DefaultedTimestamp, MinorUnits } from './column-types';

export type CustomerKind = 'business' | 'homeowner';

/** Customers, their contacts and their sites (migration 2026_12_02_0100). */
export interface CustomersTables {
  customer: {
    id: Generated<string>;
    tenantId: string;
    kind: CustomerKind;
    name: string;
    /** The firm's own reference for the customer, e.g. from its accounts package; unique per firm. */
    externalRef: string | null;
    email: string | null;
    phone: string | null;
    billingAddressLines: Defaulted<string[]>;
    postcode: string | null;
    /** Overrides the firm's payment terms when set. */
    paymentTermsDays: number | null;
    creditLimitMinor: MinorUnits | null;
    notes: Defaulted<string>;
    createdBy: string | null;
    createdAt: CreatedAt;
    updatedAt: DefaultedTimestamp;
  };
  customerContact: {
    id: Generated<string>;
    tenantId: string;
    customerId: string;
    name: string;
    role: Defaulted<string>;
    email: string | null;
    phone: string | null;
    position: Defaulted<number>;
    createdAt: CreatedAt;
  };
  site: {
    id: Generated<string>;
    tenantId: string;
    customerId: string;
    externalRef: string | null;
    name: Defaulted<string>;
    addressLines: Defaulted<string[]>;
    postcode: string | null;
    accessNotes: Defaulted<string>;
    parking: Defaulted<string>;
    floorType: Defaulted<string>;
    openingHours: Defaulted<string>;
    createdAt: CreatedAt;
    updatedAt: DefaultedTimestamp;
  };
}

import type { ColumnType } from 'kysely';

/** A timestamp column: read as Date, written as Date or ISO string, defaulted by the database. */
export type CreatedAt = ColumnType<Date, Date | string | undefined, never>;
export type Timestamp = ColumnType<Date, Date | string, Date | string>;
/** A column the database fills with its default when an insert leaves it out. */
export type Defaulted<T> = ColumnType<T, T | undefined, T>;
/** bigint money in minor units: read as text (INT8 never becomes a float), written as number, bigint or text. */
export type MinorUnits = ColumnType<string, number | bigint | string, number | bigint | string>;
/** A `date` column: read as 'YYYY-MM-DD' text (pg's date parser is turned off in connect.ts). */
export type DateOnly = ColumnType<string, string, string>;

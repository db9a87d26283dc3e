import type { ColumnType } from 'kysely';

/** A timestamp column: read as Date, written as Date or ISO string, defaulted by the database. */
export type CreatedAt = ColumnType<Date, Date | string | undefined, never>;
export type Timestamp = ColumnType<Date, Date | string, Date | string>;
/** A column the database fills with its default when an insert leaves it out (not for timestamps or dates: nesting column types makes them unwritable; use the two below). */
export type Defaulted<T> = ColumnType<T, T | undefined, T>;
/** A timestamp the database defaults on insert and the app may set later (`updated_at`). */
export type DefaultedTimestamp = ColumnType<Date, Date | string | undefined, Date | string>;
/** A calendar date the database defaults on insert ('YYYY-MM-DD'). */
export type DefaultedDate = ColumnType<string, string | undefined, string>;
/** bigint money in minor units: read as text (INT8 never becomes a float), written as number, bigint or text. */
export type MinorUnits = ColumnType<string, number | bigint | string, number | bigint | string>;
/** A `date` column: read as 'YYYY-MM-DD' text (pg's date parser is turned off in connect.ts). */
export type DateOnly = ColumnType<string, string, string>;

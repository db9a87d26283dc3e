/** Catalogue, locations, batches, the stock ledger and purchasing. */
// Filled by the stock migration.
export type StockTables = Record<never, never>;

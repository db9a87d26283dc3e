import { CamelCasePlugin, Kysely, PostgresDialect } from 'kysely';
import pg from 'pg';
import type { Database } from './database';

// Return int8/numeric as strings (never JS floats); counts are converted where read.
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => v);
// A calendar date stays 'YYYY-MM-DD': as a JS Date it would shift with the server's time zone.
pg.types.setTypeParser(pg.types.builtins.DATE, (v) => v);

export interface DbOptions {
  connectionString: string;
  /** Pool size per process; the API and worker are scaled by running more processes. */
  max?: number;
  applicationName?: string;
}

/** Opens a pooled Kysely instance for the Latchwork schema. */
export function createDb(options: DbOptions): Kysely<Database> {
  const pool = new pg.Pool({
    connectionString: options.connectionString,
    max: options.max ?? 10,
    application_name: options.applicationName ?? 'latchwork',
  });
  return new Kysely<Database>({
    dialect: new PostgresDialect({ pool }),
    plugins: [new CamelCasePlugin()],
  });
}

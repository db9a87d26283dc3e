import { promises as fs } from 'node:fs';
import path from 'node:path';
import { FileMigrationProvider, Migrator, type Kysely, type MigrationResultSet } from 'kysely';

// Migrations are written against Kysely<any>: they must not change when the Database type does.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyDb = Kysely<any>;

/**
 * Applies every migration in `folder` not yet applied, in file-name order. Migrations are
 * forward-only: there is no down step, a landed file is never edited.
 */
export async function migrateToLatest(db: AnyDb, folder: string): Promise<MigrationResultSet> {
  const migrator = new Migrator({
    db,
    provider: new FileMigrationProvider({ fs, path, migrationFolder: path.resolve(folder) }),
    // Features land in parallel, so a file may arrive named before one already applied on a
    // developer's database; each file still runs once, and a fresh database runs them in order.
    allowUnorderedMigrations: true,
  });
  return migrator.migrateToLatest();
}

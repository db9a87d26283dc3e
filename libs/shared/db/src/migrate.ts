import { promises as fs } from 'node:fs';
import path from 'node:path';
import { FileMigrationProvider, Migrator, type Kysely, type MigrationResultSet } from 'kysely';

/**
 * Applies every migration in `folder` not yet applied, in file-name order. Migrations are
 * forward-only: there is no down step, a landed file is never edited.
 */
export async function migrateToLatest(db: Kysely<any>, folder: string): Promise<MigrationResultSet> {
  const migrator = new Migrator({
    db,
    provider: new FileMigrationProvider({ fs, path, migrationFolder: path.resolve(folder) }),
  });
  return migrator.migrateToLatest();
}

// Database chores run by the scripts with tsx: `migrate`, `seed-if-empty`, `seed`.
// They connect as the schema owner (migrations create tables; the API's role cannot).
import path from 'node:path';
import { createDb, migrateToLatest } from '@latchwork/shared-db';
import { seedDemo } from '../demo/seed';

const ROOT = path.resolve(__dirname, '../..');

async function main(task: string) {
  const url = process.env['DATABASE_OWNER_URL'];
  if (!url) throw new Error('DATABASE_OWNER_URL is not set');
  const db = createDb({ connectionString: url, applicationName: `latchwork-${task}`, max: 2 });
  try {
    if (task === 'migrate') {
      const { error, results } = await migrateToLatest(db, path.join(ROOT, 'migrations'));
      for (const r of results ?? []) console.log(`migration ${r.migrationName}: ${r.status}`);
      if (error) throw error;
      if (!results?.length) console.log('migrations: already up to date');
    } else if (task === 'seed-if-empty' || task === 'seed') {
      const tenants = await db
        .selectFrom('tenant')
        .select((eb) => eb.fn.countAll<string>().as('n'))
        .executeTakeFirstOrThrow();
      if (task === 'seed-if-empty' && Number(tenants.n) > 0) {
        console.log('demo data: already loaded');
      } else {
        const summary = await seedDemo(db);
        console.log(`demo data loaded: ${summary}`);
      }
    } else {
      throw new Error(`unknown task ${task}`);
    }
  } finally {
    await db.destroy();
  }
}

main(process.argv[2] ?? '').catch((err) => {
  console.error(err);
  process.exit(1);
});

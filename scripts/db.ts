import { createDb } from '../server/db/knex';
import { loadReferenceCrops } from '../server/services/reference-crops';
import { startLocalServices } from './lib/local-env';

// `npm run db:migrate | db:rollback | db:seed | db:reset` against the local cluster
// (or DATABASE_URL when set).
const command = process.argv[2];
const services = await startLocalServices({ withMail: false });
const db = createDb(services.databaseUrl);
try {
  if (command === 'migrate') {
    const [, done] = await db.migrate.latest();
    console.log(done.length ? `Migrated: ${done.join(', ')}` : 'Already up to date.');
    await loadReferenceCrops(db);
  } else if (command === 'rollback') {
    const [, undone] = await db.migrate.rollback();
    console.log(undone.length ? `Rolled back: ${undone.join(', ')}` : 'Nothing to roll back.');
  } else if (command === 'seed') {
    await db.migrate.latest();
    await db.seed.run();
    // The seed empties the clubs and with them every crop row, so the reference crops come after it.
    await loadReferenceCrops(db);
    console.log('Demo data loaded.');
  } else if (command === 'reset') {
    await db.migrate.rollback(undefined, true);
    await db.migrate.latest();
    await db.seed.run();
    await loadReferenceCrops(db);
    console.log('Database reset to the demo data.');
  } else {
    console.error('Usage: tsx scripts/db.ts migrate|rollback|seed|reset');
    process.exitCode = 2;
  }
} finally {
  await db.destroy();
  await services.stop();
}

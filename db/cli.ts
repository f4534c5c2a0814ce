// npm run db:migrate | db:seed  (tsx db/cli.ts <command>)
import { closeDb, createDb, migrateToLatest } from './client';
import { isEmpty, seedDemo } from './seed/demo';
import { seedDemoScan } from './seed/demo-scan';

async function main(command: string | undefined, flags: string[]) {
  const db = createDb();
  try {
    const applied = await migrateToLatest(db);
    if (command === 'migrate') {
      console.log(applied.length ? `Applied: ${applied.join(', ')}` : 'Database is up to date.');
      return;
    }
    if (command === 'seed') {
      if (flags.includes('--if-empty') && !(await isEmpty(db))) {
        console.log('Database already has data; demo seed skipped.');
        return;
      }
      await seedDemo(db);
      console.log('Demo data loaded: series "Kettle Crab" and "Lantern Moth" (password kettle-crab-demo).');
      // DEMO_SCAN=off leaves the scan out (the browser tests' servers bring their own storage).
      if (process.env.DEMO_SCAN !== 'off') console.log(await seedDemoScan(db));
      return;
    }
    throw new Error(`Unknown command "${command}". Use: migrate | seed [--if-empty]`);
  } finally {
    await db.destroy();
    await closeDb();
    // The seed hashed the demo passwords in worker threads: let them go so the command ends.
    const { closeHeavyPool } = await import('@/lib/workers/pool');
    await closeHeavyPool();
  }
}

main(process.argv[2], process.argv.slice(3)).catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});

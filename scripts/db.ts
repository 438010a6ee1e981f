// Database tasks for the start and test commands, run with tsx:
//   tsx scripts/db.ts migrate        apply pending migrations
//   tsx scripts/db.ts seed-demo      add the invented demo scenario (idempotent)
// Tasks run in the order given.
import { MikroORM } from '@mikro-orm/postgresql';
import config from '../mikro-orm.config';
import { seedDemo } from '../src/lib/server/demo-data/demo';

const tasks = process.argv.slice(2);
const orm = await MikroORM.init(config);
try {
  for (const task of tasks) {
    if (task === 'migrate') {
      const applied = await orm.migrator.up();
      console.log(`[lapwing] migrations: ${applied.length ? applied.map((m) => m.name).join(', ') : 'up to date'}`);
    } else if (task === 'seed-demo') {
      const summary = await seedDemo(orm.em.fork());
      console.log(`[lapwing] demo data: ${summary}`);
    } else {
      throw new Error(`Unknown task "${task}". Known: migrate, seed-demo.`);
    }
  }
} finally {
  await orm.close();
}

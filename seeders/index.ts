// Loads the demo data into an empty database: `tsx seeders/index.ts` (npm start runs it).
import { sequelize, User } from '../server/models/index';
import { DEMO_PASSWORD, DEMO_USERS, seedUsers } from './users';

/** Seeds the demo scenario when there are no users yet; returns false when the database already had data. */
export async function seedDemo(): Promise<boolean> {
  if ((await User.count()) > 0) return false;
  await sequelize.transaction(async (transaction) => {
    await seedUsers(transaction);
  });
  return true;
}

const isMain = process.argv[1] && import.meta.url.endsWith(process.argv[1].replace(/\\/g, '/'));
if (isMain) {
  try {
    const seeded = await seedDemo();
    console.log(seeded ? 'Demo data loaded.' : 'Database already has data; demo seed skipped.');
    if (seeded || process.argv.includes('--print')) {
      console.log(`Demo accounts (password "${DEMO_PASSWORD}"):`);
      for (const u of DEMO_USERS) console.log(`  ${u.role.padEnd(10)} ${u.email}`);
    }
  } finally {
    await sequelize.close();
  }
}

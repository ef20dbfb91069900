// Loads the demo data into an empty database: `npm run db:seed` (npm start runs it in development). Never in production.
import { catalogueSpecsOf } from '../server/features/arsenal/arsenal.repository';
import { summarize } from '../server/features/patterns/patterns.service';
import crypto from 'node:crypto';
import { Ball, BallModel, Center, Condition, Follow, Lane, Pattern, SurfaceEvent, sequelize, User } from '../server/models/index';
import { DEMO_ARSENALS } from './arsenals';
import { DEMO_CATALOGUE } from './catalogue';
import { DEMO_PATTERNS } from './patterns';
import { seedShop, seedShopIfMissing } from './shop';
import { DEMO_PASSWORD, DEMO_USERS, seedUsers, verifyDemoUsers } from './users';
import { config } from '../server/config/index';
import { requestDemoCalibrations, seedSessions } from './sessions';
import { stopJobs } from '../server/lib/jobs';

const DAY_MS = 24 * 60 * 60 * 1000;

/** Seeds the demo scenario when there are no users yet; returns false when the database already had data. */
export async function seedDemo(): Promise<boolean> {
  if ((await User.count()) > 0) return false;
  await sequelize.transaction(async (transaction) => {
    const users = await seedUsers(transaction);
    const models = await BallModel.bulkCreate(
      DEMO_CATALOGUE.map((m) => ({ ...m, hardnessD: m.hardnessD ?? null, releaseYear: m.releaseYear ?? null })),
      { transaction },
    );
    const byName = new Map(models.map((m) => [m.name, m]));

    const owner = users.get('owner@copperline.example')!;
    const patterns: Pattern[] = [];
    for (const p of DEMO_PATTERNS) {
      const summary = summarize(p);
      for (const k of ['lengthClass', 'volumeClass', 'ratioClass'] as const) {
        if (summary[k] !== p.expect[k]) throw new Error(`demo pattern ${p.name}: ${k} is ${summary[k]}, designed as ${p.expect[k]}`);
      }
      patterns.push(
        await Pattern.create({ ownerId: owner.id, name: p.name, description: p.description, sweeps: p.sweeps, summary }, { transaction }),
      );
    }

    // Copperline Bowl, Harrow Bay: 24 lanes in two lane groups, the house shot on 1–16 and a sport pattern on 17–24.
    const center = await Center.create(
      { name: 'Copperline Bowl', town: 'Harrow Bay', laneCount: 24, timeZone: 'America/Denver', ownerId: owner.id },
      { transaction },
    );
    await Lane.bulkCreate(
      Array.from({ length: 24 }, (_, i) => ({ centerId: center.id, number: i + 1, notes: null })),
      { transaction },
    );
    await Center.create(
      { name: 'Gullwing Lanes', town: 'Stonereach', laneCount: 16, timeZone: 'America/Chicago', ownerId: null },
      { transaction },
    );
    await seedShop(center.id, transaction);
    const weekAgo = new Date(Date.now() - 7 * DAY_MS);
    const house = patterns[0];
    const sport = patterns.find((p) => p.name === 'Long Haul 47')!;
    // The sport lanes were published first (an hour earlier), so the house shot stays the newest publication.
    await Condition.create(
      {
        centerId: center.id,
        patternId: sport.id,
        patternName: sport.name,
        sweeps: sport.sweeps,
        summary: sport.summary,
        lanes: Array.from({ length: 8 }, (_, i) => i + 17),
        validFrom: weekAgo.toISOString().slice(0, 10),
        validTo: null,
        notes: 'Sport lanes for the Thursday scratch league and practice; ask the desk for a pair.',
        publishedAt: new Date(weekAgo.getTime() - 3600_000),
        publishedBy: owner.id,
        laneKind: 'synthetic',
        laneFriction: 'high',
      },
      { transaction },
    );
    await Condition.create(
      {
        centerId: center.id,
        patternId: house.id,
        patternName: house.name,
        sweeps: house.sweeps,
        summary: house.summary,
        lanes: Array.from({ length: 16 }, (_, i) => i + 1),
        validFrom: weekAgo.toISOString().slice(0, 10),
        validTo: null,
        notes: 'Lanes stripped and oiled every morning at 9. Approaches cleaned nightly.',
        publishedAt: weekAgo,
        publishedBy: owner.id,
        // Synthetic panels with a textured top sheet: the ball grips hard once it leaves the oil.
        laneKind: 'synthetic',
        laneFriction: 'high',
      },
      { transaction },
    );
    for (const email of ['dana@copperline.example', 'lee@copperline.example', 'coach@copperline.example']) {
      await Follow.create(
        { userId: users.get(email)!.id, centerId: center.id, unsubscribeToken: crypto.randomBytes(24).toString('base64url') },
        { transaction },
      );
    }

    const now = Date.now();
    for (const [email, balls] of Object.entries(DEMO_ARSENALS)) {
      const user = users.get(email)!;
      for (const d of balls) {
        const m = byName.get(d.model);
        if (!m) throw new Error(`demo arsenal of ${email}: no catalogue ball ${d.model}`);
        const grit = d.surfaceGrit ?? m.factoryGrit;
        const polished = d.polished ?? m.factoryPolished;
        const ball = await Ball.create(
          {
            ownerId: user.id,
            ...catalogueSpecsOf(m),
            nickname: d.nickname ?? null,
            weightLb: d.weightLb,
            surfaceGrit: grit,
            polished,
            layout: d.layout,
            gamesSinceResurface: d.games,
          },
          { transaction },
        );
        const history = d.history ?? [[m.factoryGrit, m.factoryPolished, 90, 'Out of the box']];
        let prev: [number, boolean] | null = null;
        for (const [g, pol, daysAgo, note] of history) {
          await SurfaceEvent.create(
            {
              ballId: ball.id,
              fromGrit: prev?.[0] ?? null,
              fromPolished: prev?.[1] ?? null,
              toGrit: g,
              toPolished: pol,
              at: new Date(now - daysAgo * DAY_MS),
              byUserId: user.id,
              note,
            },
            { transaction },
          );
          prev = [g, pol];
        }
      }
    }
    await seedSessions(users, transaction);
  });
  return true;
}

const isMain = process.argv[1] && import.meta.url.endsWith(process.argv[1].replace(/\\/g, '/'));
if (isMain) {
  if (config.NODE_ENV === 'production') {
    // The demo accounts share a password printed in the README: they must never exist in a production database.
    console.error('Refusing to seed: NODE_ENV=production. The demo data (with its published password) is for development only.');
    await sequelize.close();
    process.exit(1);
  }
  try {
    const seeded = await seedDemo();
    if (!seeded) await verifyDemoUsers();
    if (!seeded && (await seedShopIfMissing())) console.log('Pro-shop price list added to Copperline Bowl.');
    if (seeded) await requestDemoCalibrations();
    console.log(seeded ? 'Demo data loaded.' : 'Database already has data; demo seed skipped.');
    if (seeded || process.argv.includes('--print')) {
      console.log(`Demo accounts (password "${DEMO_PASSWORD}"):`);
      for (const u of DEMO_USERS) console.log(`  ${u.role.padEnd(10)} ${u.email}`);
    }
  } finally {
    await stopJobs();
    await sequelize.close();
  }
}

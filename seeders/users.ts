import type { Transaction } from 'sequelize';
import type { Role } from '../shared/auth';
import type { Profile } from '../shared/profile';
import { hashPassword } from '../server/features/auth/auth.service';
import { BowlerProfile, User } from '../server/models/index';

export const DEMO_PASSWORD = 'lanewright-demo';

interface DemoUser {
  email: string;
  displayName: string;
  role: Role;
  profile?: Profile;
}

/** Invented people of the demo scenario. */
export const DEMO_USERS: DemoUser[] = [
  { email: 'admin@lanewright.example', displayName: 'Sam Okafor-Reyes', role: 'admin' },
  { email: 'owner@copperline.example', displayName: 'Marguerite Vale', role: 'proprietor' },
  {
    email: 'coach@copperline.example',
    displayName: 'Tobias Wren',
    role: 'coach',
    profile: {
      hand: 'right',
      speedMph: 17.5,
      revRpm: 340,
      axisRotationDeg: 45,
      axisTiltDeg: 12,
      papRightIn: 5.25,
      papUpIn: 0.5,
      units: 'imperial',
    },
  },
  {
    email: 'dana@copperline.example',
    displayName: 'Dana Holloway',
    role: 'bowler',
    profile: {
      hand: 'right',
      speedMph: 16.5,
      revRpm: 380,
      axisRotationDeg: 50,
      axisTiltDeg: 14,
      papRightIn: 5.5,
      papUpIn: 0.75,
      units: 'imperial',
    },
  },
  {
    email: 'lee@copperline.example',
    displayName: 'Lee Marchetti',
    role: 'bowler',
    profile: {
      hand: 'left',
      speedMph: 18.5,
      revRpm: 260,
      axisRotationDeg: 35,
      axisTiltDeg: 18,
      papRightIn: 4.75,
      papUpIn: 0.25,
      units: 'metric',
    },
  },
];

export async function seedUsers(transaction: Transaction): Promise<Map<string, User>> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const byEmail = new Map<string, User>();
  for (const d of DEMO_USERS) {
    // The demo accounts' addresses count as confirmed (they are invented; nobody could follow a link).
    const user = await User.create(
      { email: d.email, passwordHash, displayName: d.displayName, role: d.role, emailVerifiedAt: new Date() },
      { transaction },
    );
    if (d.profile) await BowlerProfile.create({ userId: user.id, ...d.profile }, { transaction });
    byEmail.set(d.email, user);
  }
  return byEmail;
}

/** A database seeded before addresses were verified: the demo accounts still count as confirmed. */
export async function verifyDemoUsers(): Promise<number> {
  const [count] = await User.update(
    { emailVerifiedAt: new Date() },
    { where: { email: DEMO_USERS.map((d) => d.email), emailVerifiedAt: null } },
  );
  return count;
}

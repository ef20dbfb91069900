// Every migration in name order. A static list (not a file glob) so the production build bundles them; a test
// checks that it names every file of this folder. Add a new migration file here too.
import * as m0001 from './20261201-0001-users';
import * as m0002 from './20261201-0002-balls-patterns';
import * as m0003 from './20261201-0003-centers-conditions';
import * as m0004 from './20261201-0004-uploads';
import * as m0005 from './20261201-0005-sessions-coaching';
import * as m0006 from './20261201-0006-shop';
import * as m0007a from './20261215-0001-lane-surface-approval-year';
import * as m0007 from './20261215-0007-account-security';
import * as m0008 from './20261220-0008-production-service';
import * as m0009 from './20261220-0009-calibration-fits-by-lane';
import * as m0010 from './20261222-0010-change-feed-and-list-indexes';
import * as m0011 from './20261222-0011-trials';
import * as m0012 from './20261230-0012-center-time-zone';
import * as m0013 from './20261230-0013-condition-schedules';
import * as m0014 from './20261230-0014-roles-and-pattern-visibility';
import * as m0015 from './20261230-0015-shop-counter';
import * as m0016 from './20261230-0016-shot-aggregates';
import * as m0017 from './20261230-0017-leagues-and-lane-pairs';
import * as m0018 from './20261230-0018-ball-upkeep';
import * as m0019 from './20261230-0019-plan-replies';
import * as m0020 from './20261230-0020-shot-release';
import type { QueryInterface } from 'sequelize';

export interface MigrationModule {
  up: (args: { context: QueryInterface }) => Promise<void>;
  down: (args: { context: QueryInterface }) => Promise<void>;
}

/** Names keep the `.ts` ending umzug's glob gave them, so databases migrated before stay in step. */
export const MIGRATIONS: { name: string; module: MigrationModule }[] = [
  { name: '20261201-0001-users.ts', module: m0001 },
  { name: '20261201-0002-balls-patterns.ts', module: m0002 },
  { name: '20261201-0003-centers-conditions.ts', module: m0003 },
  { name: '20261201-0004-uploads.ts', module: m0004 },
  { name: '20261201-0005-sessions-coaching.ts', module: m0005 },
  { name: '20261201-0006-shop.ts', module: m0006 },
  { name: '20261215-0001-lane-surface-approval-year.ts', module: m0007a },
  { name: '20261215-0007-account-security.ts', module: m0007 },
  { name: '20261220-0008-production-service.ts', module: m0008 },
  { name: '20261220-0009-calibration-fits-by-lane.ts', module: m0009 },
  { name: '20261222-0010-change-feed-and-list-indexes.ts', module: m0010 },
  { name: '20261222-0011-trials.ts', module: m0011 },
  { name: '20261230-0012-center-time-zone.ts', module: m0012 },
  { name: '20261230-0013-condition-schedules.ts', module: m0013 },
  { name: '20261230-0014-roles-and-pattern-visibility.ts', module: m0014 },
  { name: '20261230-0015-shop-counter.ts', module: m0015 },
  { name: '20261230-0016-shot-aggregates.ts', module: m0016 },
  { name: '20261230-0017-leagues-and-lane-pairs.ts', module: m0017 },
  { name: '20261230-0018-ball-upkeep.ts', module: m0018 },
  { name: '20261230-0019-plan-replies.ts', module: m0019 },
  { name: '20261230-0020-shot-release.ts', module: m0020 },
];

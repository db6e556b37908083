import type { QueryInterface } from 'sequelize';
import * as m0001 from './0001-people-and-farms';
import * as m0002 from './0002-site-readings';
import * as m0003 from './0003-screenings-audit-sync';
import * as m0004 from './0004-ordered-revisions';
import * as m0005 from './0005-farmer-sheets';
import * as m0006 from './0006-office-invitations-and-indexes';
import * as m0007 from './0007-visit-exposure';
import * as m0008 from './0008-millisecond-times';
import * as m0011 from './0011-profile-stations-and-commissioning';
import * as m0012 from './0012-office-scale-indexes';
import * as m0013 from './0013-office-area-indexes';
import * as m0014 from './0014-sheet-conversations';
import * as m0015 from './0015-invitation-withdrawal';
import * as m0016 from './0016-ended-sessions';
import * as m0017 from './0017-demand-confirmations';
import * as m0018 from './0018-waste-valve-stroke';

export interface MigrationModule {
  up(params: { context: QueryInterface }): Promise<void>;
  down(params: { context: QueryInterface }): Promise<void>;
}

// Every migration, in order. Listed statically so tsx, vitest and Next load them the same way.
export const MIGRATIONS: { name: string; module: MigrationModule }[] = [
  { name: '0001-people-and-farms.ts', module: m0001 },
  { name: '0002-site-readings.ts', module: m0002 },
  { name: '0003-screenings-audit-sync.ts', module: m0003 },
  { name: '0004-ordered-revisions.ts', module: m0004 },
  { name: '0005-farmer-sheets.ts', module: m0005 },
  { name: '0006-office-invitations-and-indexes.ts', module: m0006 },
  { name: '0007-visit-exposure.ts', module: m0007 },
  { name: '0008-millisecond-times.ts', module: m0008 },
  { name: '0011-profile-stations-and-commissioning.ts', module: m0011 },
  { name: '0012-office-scale-indexes.ts', module: m0012 },
  { name: '0013-office-area-indexes.ts', module: m0013 },
  { name: '0014-sheet-conversations.ts', module: m0014 },
  { name: '0015-invitation-withdrawal.ts', module: m0015 },
  { name: '0016-ended-sessions.ts', module: m0016 },
  { name: '0017-demand-confirmations.ts', module: m0017 },
  { name: '0018-waste-valve-stroke.ts', module: m0018 },
];

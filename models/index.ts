import { QueryTypes, type Model, type ModelStatic, type Sequelize, type Transaction } from 'sequelize';
import { AuditEntry } from './audit-entry';
import { DemandLine } from './demand-line';
import { FallReading } from './fall-reading';
import { Farm } from './farm';
import { FlowMeasurement } from './flow-measurement';
import { Organisation } from './organisation';
import { Photo } from './photo';
import { PipeRun } from './pipe-run';
import { Point } from './point';
import { Screening } from './screening';
import { SignInAttempt } from './sign-in-attempt';
import { SyncOp } from './sync-op';
import { User } from './user';
import { Visit } from './visit';
import { WaterSource } from './water-source';

export {
  AuditEntry, DemandLine, FallReading, Farm, FlowMeasurement, Organisation, Photo, PipeRun, Point,
  Screening, SignInAttempt, SyncOp, User, Visit, WaterSource,
};
export type { OrganisationSettings } from './organisation';

/** Models whose rows sync with the phone: each save takes a fresh revision. */
export const syncedModels = [Farm, Visit, WaterSource, FlowMeasurement, FallReading, Point, Photo, DemandLine, PipeRun];

/** Next value of the database-wide revision sequence (the pull cursor). */
export async function nextRev(sequelize: Sequelize, transaction?: Transaction | null): Promise<number> {
  const [row] = await sequelize.query<{ rev: number | bigint }>('SELECT NEXTVAL(change_rev) AS rev', {
    type: QueryTypes.SELECT,
    transaction: transaction ?? undefined,
  });
  if (!row) throw new Error('change_rev sequence returned nothing');
  return Number(row.rev);
}

function addRevisionHooks(sequelize: Sequelize, model: ModelStatic<Model>) {
  model.addHook('beforeSave', async (instance: Model, options: { transaction?: Transaction | null }) => {
    instance.set('rev', await nextRev(sequelize, options.transaction));
  });
  model.addHook('beforeBulkCreate', async (instances: Model[], options: { transaction?: Transaction | null }) => {
    for (const instance of instances) instance.set('rev', await nextRev(sequelize, options.transaction));
  });
}

// Model names are set explicitly in each init: a minified production build renames the classes.
let initialised: Sequelize | undefined;

/** Initialises every model on one Sequelize instance and wires the associations (once). */
export function initModels(sequelize: Sequelize) {
  if (initialised === sequelize) return;
  initialised = sequelize;
  for (const model of [
    Organisation, User, Farm, Visit, WaterSource, FlowMeasurement, FallReading, Point, Photo,
    DemandLine, PipeRun, Screening, AuditEntry, SyncOp, SignInAttempt,
  ]) model.initModel(sequelize);

  Organisation.hasMany(User, { foreignKey: 'organisationId' });
  User.belongsTo(Organisation, { foreignKey: 'organisationId' });
  Farm.belongsTo(Organisation, { foreignKey: 'organisationId' });
  Farm.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' });
  Farm.hasMany(Visit, { foreignKey: 'farmId' });
  Farm.hasMany(DemandLine, { foreignKey: 'farmId' });
  Visit.belongsTo(Farm, { foreignKey: 'farmId' });
  Visit.belongsTo(User, { as: 'advisor', foreignKey: 'advisorId' });
  const visitChildren = [WaterSource, FlowMeasurement, FallReading, Point, Photo, PipeRun, Screening] as ModelStatic<Model>[];
  for (const child of visitChildren) {
    Visit.hasMany(child, { foreignKey: 'visitId' });
    child.belongsTo(Visit, { foreignKey: 'visitId' });
  }
  for (const model of syncedModels) addRevisionHooks(sequelize, model as ModelStatic<Model>);
}

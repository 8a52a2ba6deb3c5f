import type { Sequelize } from 'sequelize';
import { Athlete } from './athlete';
import { AuditEvent } from './audit-event';
import { Clinic } from './clinic';
import { Injury } from './injury';
import { Measurement } from './measurement';
import { Run } from './run';
import { RunLogEntry } from './run-log-entry';
import { Sequence } from './sequence';
import { User } from './user';

export { Athlete, AuditEvent, Clinic, Injury, Measurement, Run, RunLogEntry, Sequence, User };

export function initModels(sequelize: Sequelize) {
  Clinic.initModel(sequelize);
  User.initModel(sequelize);
  AuditEvent.initModel(sequelize);
  Athlete.initModel(sequelize);
  Injury.initModel(sequelize);
  Measurement.initModel(sequelize);
  Sequence.initModel(sequelize);
  Run.initModel(sequelize);
  RunLogEntry.initModel(sequelize);
}

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
import { AuthToken } from './auth-token';
import { MailboxMessage } from './mailbox-message';
import { OutboundEmail } from './outbound-email';
import { Upload } from './upload';
import { SessionNote } from './session-note';

export { Athlete, AuditEvent, Clinic, Injury, Measurement, Run, RunLogEntry, Sequence, User };
export { AuthToken, MailboxMessage, OutboundEmail, Upload };
export { SessionNote };

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
  OutboundEmail.initModel(sequelize);
  MailboxMessage.initModel(sequelize);
  AuthToken.initModel(sequelize);
  Upload.initModel(sequelize);
  SessionNote.initModel(sequelize);

  // Erased athletes get no new clinical records, whichever service adds them (docs/decisions/0090).
  Injury.addHook('beforeCreate', 'refuseErasedAthlete', (row: Injury, options) => Athlete.refuseIfErased({ athleteId: row.athleteId }, options.transaction));
  Run.addHook('beforeCreate', 'refuseErasedAthlete', (row: Run, options) => Athlete.refuseIfErased({ athleteId: row.athleteId }, options.transaction));
  Upload.addHook('beforeCreate', 'refuseErasedAthlete', (row: Upload, options) => Athlete.refuseIfErased({ athleteId: row.athleteId }, options.transaction));
  Measurement.addHook('beforeCreate', 'refuseErasedAthlete', (row: Measurement, options) => Athlete.refuseIfErased({ injuryId: row.injuryId }, options.transaction));
  SessionNote.addHook('beforeCreate', 'refuseErasedAthlete', (row: SessionNote, options) => Athlete.refuseIfErased({ runId: row.runId }, options.transaction));
}

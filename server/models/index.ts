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
}

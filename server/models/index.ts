import type { Sequelize } from 'sequelize';
import { AuditEvent } from './audit-event';
import { Clinic } from './clinic';
import { User } from './user';

export { AuditEvent, Clinic, User };

export function initModels(sequelize: Sequelize) {
  Clinic.initModel(sequelize);
  User.initModel(sequelize);
  AuditEvent.initModel(sequelize);
}

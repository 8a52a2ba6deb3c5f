import { Sequelize } from 'sequelize';
import { initModels } from '../models';

let sequelize: Sequelize | undefined;

/** One shared connection for the process; models are bound to it on first call. */
export function connectDatabase(databaseUrl: string): Sequelize {
  if (sequelize) return sequelize;
  sequelize = new Sequelize(databaseUrl, {
    dialect: 'postgres',
    logging: false,
    define: { underscored: true },
    pool: { max: 10, min: 0, idle: 10_000 },
  });
  initModels(sequelize);
  return sequelize;
}

export async function closeDatabase(): Promise<void> {
  if (!sequelize) return;
  const s = sequelize;
  sequelize = undefined;
  await s.close();
}

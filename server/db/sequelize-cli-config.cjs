// sequelize-cli reads this; every environment takes its database from DATABASE_URL (set by scripts/).
const url = process.env.DATABASE_URL;
if (!url) {
  throw new Error('DATABASE_URL is not set: run through npm start / npm test, or set it yourself');
}
const common = {
  url,
  dialect: 'postgres',
  logging: false,
  // Track seeders so a second run inserts nothing twice.
  seederStorage: 'sequelize',
  migrationStorageTableName: 'sequelize_meta',
  seederStorageTableName: 'sequelize_data',
};
module.exports = { development: common, test: common, production: common };

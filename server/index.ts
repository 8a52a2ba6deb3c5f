import { assertDeployable, loadConfig } from './config';
import { createApp } from './app';
import { closeDatabase } from './db/connection';

const config = loadConfig();
assertDeployable(config);
const { app, pool, mail } = createApp(config);

const server = app.listen(config.port, config.host, () => {
  console.log(`Mendstep is serving on http://${config.host}:${config.port}`);
});

function shutdown() {
  server.close(() => {
    mail
      .stop()
      .finally(() => Promise.all([pool.end(), closeDatabase()]))
      .finally(() => process.exit(0));
  });
  setTimeout(() => process.exit(0), 5000).unref();
}
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);

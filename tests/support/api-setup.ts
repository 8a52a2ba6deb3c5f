// API and end-to-end tests run against the real PostgreSQL that `npm test` started (DATABASE_URL).
if (!process.env.DATABASE_URL) {
  throw new Error('DATABASE_URL is not set: run the suite with `npm test`, which starts its own PostgreSQL');
}
process.env.NODE_ENV = 'test';

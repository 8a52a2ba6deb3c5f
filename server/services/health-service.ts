import type pg from 'pg';

export interface Health {
  ok: boolean;
  database: 'up' | 'down';
}

/** A load balancer's probe must get an answer even when PostgreSQL hangs rather than refuses. */
const probeTimeoutMs = 2000;

/** The database answers `SELECT 1` through the pool the sessions use, within the timeout. */
export async function checkHealth(pool: pg.Pool): Promise<Health> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error('database probe timed out')), probeTimeoutMs);
  });
  try {
    await Promise.race([pool.query('SELECT 1'), timeout]);
    return { ok: true, database: 'up' };
  } catch {
    return { ok: false, database: 'down' };
  } finally {
    clearTimeout(timer);
  }
}

import { Router } from 'express';
import type { Knex } from 'knex';

/** GET /api/health: the server answers and says whether the database does. */
export function healthRouter(db: Knex): Router {
  const r = Router();
  r.get('/', async (_req, res) => {
    let database: 'up' | 'down' = 'up';
    try {
      await db.raw('SELECT 1');
    } catch {
      database = 'down';
    }
    res.status(database === 'up' ? 200 : 503).json({ status: database === 'up' ? 'ok' : 'degraded', database });
  });
  return r;
}

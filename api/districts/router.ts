import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { inputOf, validate } from '../http/validate';
import * as service from './service';

export const districtCode = z.string().regex(/^[A-Za-z0-9_-]{1,32}$/, 'a district code is 1–32 letters, digits, _ or -');
const byCode = { params: z.object({ code: districtCode }) };

export function districtsRouter(db: Knex): Router {
  const r = Router();
  r.get('/', async (_req, res) => {
    res.json({ districts: await service.listDistricts(db) });
  });
  r.get('/:code', validate(byCode), async (_req, res) => {
    const { params } = inputOf(res, byCode);
    res.json(await service.getDistrict(db, params.code));
  });
  return r;
}

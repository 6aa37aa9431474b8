/** Request schemas and options of the uploads API. */
import { z } from 'zod';
import { idParams } from '../http/validate';

/** "true"/"false"/"1"/"0" in a query string. */
export const queryBool = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'])
  .transform((v) => v === 'true' || v === '1' || v === 'yes');

/** A key the client chooses to follow an upload's progress (GET /api/uploads/progress/:key). */
export const progressKey = z
  .string()
  .regex(/^[A-Za-z0-9_-]{16,64}$/, 'a progress key is 16 to 64 letters, digits, "-" or "_"');

export const progressParams = z.object({ key: progressKey });

/** POST /api/uploads/:id/commit: only the progress key. */
export const uploadCommitQuery = z.object({ progress: progressKey.optional() });

export const uploadQuery = z.object({
  /** Report phases and counts under this key while the upload runs. */
  progress: progressKey.optional(),
  commit: queryBool.default(false),
  allowNewDistricts: queryBool.default(false),
  decimalComma: queryBool.default(false),
  /** A stored value changing by more than this factor (either way) is flagged; default: the admin setting uploadChangeFactor. */
  changeFactor: z.coerce.number().gt(1, 'changeFactor must be greater than 1').max(1e6).optional(),
});

export interface UploadOptions {
  allowNewDistricts: boolean;
  decimalComma: boolean;
  changeFactor: number;
}

export const uploadIdParams = idParams;

export const uploadListQuery = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(50),
  /** Uploads with an id below this one (the next page). */
  before: z.coerce.number().int().positive().optional(),
  status: z.enum(['previewed', 'committed', 'reverted', 'failed']).optional(),
});

import { z } from 'zod';

export const idParamsSchema = z.object({ id: z.guid({ message: 'Must be a record id (UUID).' }) });

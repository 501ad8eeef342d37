import { z } from 'zod';

/** A record id in a path: a UUID, else 400 "Not a valid id". */
export const idSchema = z.uuid({ error: 'Not a valid id' });

/** Route params `{ id }` of one record. */
export const idParamsSchema = z.object({ id: idSchema });

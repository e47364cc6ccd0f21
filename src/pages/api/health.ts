import { endpoint, json, methodNotAllowed } from '@/lib/http/api';
import { health } from '@/lib/live/health.server';

/** Whether this process can serve: open to anyone (a load balancer asks), names no secret. 503 without the database. */
export const GET = endpoint(async () => json(await health()));

export const ALL = methodNotAllowed;

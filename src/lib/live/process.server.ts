// Which process this is, as GET /api/health and the logs name it.
import { randomBytes } from 'node:crypto';

/**
 * Distinct for every process start, on one machine or many, without naming the host on a public route; the log
 * line written when notices first connect pairs it with pino's own hostname and pid.
 */
export const processIdentity = { id: `web-${process.pid}-${randomBytes(3).toString('hex')}`, role: 'web' as 'web' | 'worker' };

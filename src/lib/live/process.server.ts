// Which process this is, as GET /api/health and the logs name it.
import { randomBytes } from 'node:crypto';
import { PROCESS_ROLE } from 'astro:env/server';

/**
 * Distinct for every process start, on one machine or many, without naming the host on a public route; the log
 * line written when notices first connect pairs it with pino's own hostname and pid. The role is PROCESS_ROLE
 * (`web` unless the process was started as the queue's worker).
 */
const role: 'web' | 'worker' = PROCESS_ROLE === 'worker' ? 'worker' : 'web';
export const processIdentity = { id: `${role}-${process.pid}-${randomBytes(3).toString('hex')}`, role };

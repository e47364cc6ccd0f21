// The process itself: its health answer is public (a load balancer asks without an account) and changes nothing.
import { all, type Route } from './route';

export default [{ method: 'GET', file: 'health.ts', path: () => '/api/health', expect: all(200, { anonymous: 200 }), mutates: false }] satisfies Route[];

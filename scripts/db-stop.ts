// `npm run db:stop`: stop the project's PostgreSQL cluster.
import { join } from 'node:path';
import { stopCluster } from './lib/postgres';
import { dataDir } from './lib/settings';

stopCluster(join(dataDir, 'postgres'));
console.log('PostgreSQL stopped.');

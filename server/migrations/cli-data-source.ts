import path from 'node:path';
import { readConfig } from '../config.js';
import { createDataSource } from '../data-source.js';

/** The data source the TypeORM CLI uses (`npm run migration:generate -- server/migrations/<name>`). */
export default createDataSource(path.join(readConfig().dataDir, 'hueledger.sqlite'));

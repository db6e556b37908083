// The field pages' dedicated worker: the sync loop and the shared field queries (worker-api.ts),
// offered to the page through Comlink.
import * as Comlink from 'comlink';
import { fieldWorkerApi } from './worker-api';

Comlink.expose(fieldWorkerApi);

// Serves the adapter-node build and exits if the launcher that started it disappears.
import path from 'node:path';
import { exitWhenOrphaned } from './lib/orphan-guard.js';

const dir = process.env.BUILD_DIR ?? 'build';
exitWhenOrphaned(() => undefined);
await import(path.resolve(dir, 'index.js'));

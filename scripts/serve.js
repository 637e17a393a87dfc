// Serves the adapter-node build (compressed: lib/http-server.js) and exits if the launcher that
// started it disappears.
import { serveBuild } from './lib/http-server.js';
import { exitWhenOrphaned } from './lib/orphan-guard.js';

const dir = process.env.BUILD_DIR ?? 'build';
exitWhenOrphaned(() => undefined);
await serveBuild(dir);

// One digest sweep in a process of its own, as an app process runs it: the fault tests start two
// at once against the cluster's primary. Argument: the sweep's clock, in ms since the epoch.
import { flushCommentDigests } from '../../src/lib/server/comments/digest';
import { closeDb } from '../../src/lib/server/db/connection';

await flushCommentDigests(new Date(Number(process.argv[2])));
await closeDb();

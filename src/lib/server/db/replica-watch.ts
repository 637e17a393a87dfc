import { env } from '../env';
import { replicaReached, replicated, writtenPosition } from './connection';
import { pauseReplica } from './replica';

// A replica can answer and still fall behind: its applier stopped, or a burst of writes it has
// not caught up with. Members who saved are covered (read-your-writes); everyone else would read
// old data. So each process notes the primary's binlog position every tick, and asks the replica
// (without waiting) whether it has reached the position noted DB_REPLICA_MAX_LAG_S ago; if not,
// reads go to the primary until the next tick.

const noted: { at: number; position: string }[] = [];
const TICK_MS = 1000;

export async function watchReplicaOnce(now = Date.now()): Promise<void> {
	const position = await writtenPosition();
	if (position) noted.push({ at: now, position });
	const due = now - env().DB_REPLICA_MAX_LAG_S * 1000;
	let oldest: string | null = null;
	while (noted.length && noted[0].at <= due) oldest = noted.shift()!.position;
	if (oldest && !(await replicaReached(oldest, 0, { evenIfPaused: true })))
		pauseReplica((2 * TICK_MS) / 1000, now);
}

/** Starts the watch when a replica is configured; returns the stop function. */
export function watchReplica(): () => void {
	if (!replicated()) return () => undefined;
	const timer = setInterval(() => {
		watchReplicaOnce().catch(() => undefined);
	}, TICK_MS);
	timer.unref();
	return () => clearInterval(timer);
}

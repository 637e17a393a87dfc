// A fake service started by the launcher exits when the launcher is gone (even after kill -9),
// so no stray server is left holding a port.
export function exitWhenOrphaned(onExit) {
	const parent = process.ppid;
	const timer = setInterval(() => {
		if (process.ppid !== parent) {
			clearInterval(timer);
			Promise.resolve(onExit()).finally(() => process.exit(0));
		}
	}, 1000);
	timer.unref();
}

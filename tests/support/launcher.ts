import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../..');

/**
 * Starts `scripts/stack.js <mode>` and resolves once it prints `<marker> {json}`, with that JSON;
 * rejects with everything it printed if it exits first or takes longer than `ms`.
 */
export function launch<T>(
	mode: string,
	env: NodeJS.ProcessEnv,
	marker: string,
	ms: number,
	onOutput?: (child: ChildProcess) => void
): Promise<{ child: ChildProcess; ready: T }> {
	const child = spawn(process.execPath, ['scripts/stack.js', mode], {
		cwd: root,
		env,
		stdio: ['ignore', 'pipe', 'pipe']
	});
	onOutput?.(child);
	let out = '';
	const pattern = new RegExp(`${marker} (\\{.*\\})`);
	return new Promise((resolve, reject) => {
		const timer = setTimeout(
			() => reject(new Error(`launcher not ready in ${ms / 1000} s:\n${out}`)),
			ms
		);
		const onData = (d: Buffer) => {
			out += d.toString();
			const m = out.match(pattern);
			if (m) {
				clearTimeout(timer);
				resolve({ child, ready: JSON.parse(m[1]) as T });
			}
		};
		child.stdout!.on('data', onData);
		child.stderr!.on('data', onData);
		child.once('exit', (code) => {
			clearTimeout(timer);
			reject(new Error(`launcher exited (${code}) before ready:\n${out}`));
		});
	});
}

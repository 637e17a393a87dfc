// Types for nginx.js (plain JavaScript: it runs before anything is installed).
export function nginxConfig(o: {
	port: string | number;
	appPorts: number[];
	runDir: string;
	buildDir: string;
	asRoot: boolean;
	withBrotli: boolean;
}): string;
export function startNginx(
	e: Record<string, string>,
	appPorts: number[]
): Promise<{ pid: number; stop: () => Promise<void> }>;

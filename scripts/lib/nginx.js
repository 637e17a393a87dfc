// nginx (Debian's package) as the edge in front of several app processes: load balancing,
// compression, the build's immutable files served from disk, and a short cache for anonymous
// answers the app marks public. Its configuration is written from the stack's settings into the
// run folder on every start; nothing of the system's /etc/nginx is used but the MIME types.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fail, which } from './install.js';
import { readPid, stopPid, stopStale, waitForPort } from './proc.js';

const MODULES = '/usr/lib/nginx/modules';
const brotli = () => fs.existsSync(path.join(MODULES, 'ngx_http_brotli_filter_module.so'));

/** The configuration text: pure, so a unit test can read it. */
export function nginxConfig({ port, appPorts, runDir, buildDir, asRoot, withBrotli }) {
	const dir = (d) => path.join(runDir, 'nginx', d);
	const types = 'text/plain text/css application/javascript application/json image/svg+xml';
	return `# Written by scripts/lib/nginx.js on every start: edit that file, not this one.
${withBrotli ? `load_module ${MODULES}/ngx_http_brotli_filter_module.so;\nload_module ${MODULES}/ngx_http_brotli_static_module.so;\n` : ''}daemon off;
${asRoot ? 'user root;\n' : ''}worker_processes auto;
pid ${path.join(runDir, 'nginx.pid')};
error_log ${path.join(runDir, 'nginx-error.log')} warn;
events { worker_connections 4096; }

http {
	include /etc/nginx/mime.types;
	default_type application/octet-stream;
	access_log off;
	sendfile on;
	tcp_nopush on;
	server_tokens off;
	client_max_body_size 16m;
	client_body_temp_path ${dir('body')};
	proxy_temp_path ${dir('proxy')};
	fastcgi_temp_path ${dir('fastcgi')};
	uwsgi_temp_path ${dir('uwsgi')};
	scgi_temp_path ${dir('scgi')};

	# Answers the app did not compress already (it compresses what it sends; nginx keeps those).
	gzip on;
	gzip_comp_level 5;
	gzip_min_length 1024;
	gzip_proxied any;
	gzip_vary on;
	gzip_types ${types};
${withBrotli ? `	brotli on;\n	brotli_comp_level 4;\n	brotli_min_length 1024;\n	brotli_types ${types};\n` : ''}
	upstream squishline_app {
${appPorts.map((p) => `		server 127.0.0.1:${p} max_fails=1 fail_timeout=2s;`).join('\n')}
		keepalive 64;
	}

	# Signed-in members, and members who just saved (read-your-writes cookie), never share answers.
	map $http_cookie $personal {
		default 0;
		"~authjs\\.session-token" 1;
		"~(^|;\\s*)sl_written=" 1;
	}

	proxy_cache_path ${dir('cache')} levels=1:2 keys_zone=public_answers:16m max_size=512m inactive=10m use_temp_path=off;

	server {
		listen 127.0.0.1:${port};

		# Hashed file names: they never change, so browsers keep them for a year.
		location /_app/immutable/ {
			alias ${path.join(buildDir, 'client', '_app', 'immutable')}/;
			gzip_static on;
${withBrotli ? '			brotli_static on;\n' : ''}			add_header Cache-Control "public, max-age=31536000, immutable";
		}

		location / {
			# Cached answers written with sendfile waited out the client's delayed ACK (about
			# 40 ms each, measured); from memory buffers they go at once.
			sendfile off;
			proxy_pass http://squishline_app;
			proxy_http_version 1.1;
			proxy_set_header Connection "";
			proxy_set_header Host $http_host;
			# The edge: the peer's own address replaces whatever a client sent.
			proxy_set_header X-Forwarded-For $remote_addr;
			proxy_set_header X-Forwarded-Proto $scheme;
			# A stopped app process: connection refused goes to the next one (GET and HEAD only;
			# a POST is never sent twice).
			proxy_next_upstream error timeout http_502;
			proxy_connect_timeout 2s;
			# Room for the app's headers (security policy, preload links, session cookies).
			proxy_buffer_size 32k;
			proxy_buffers 16 32k;
			proxy_busy_buffers_size 64k;
			proxy_read_timeout 60s;

			# Only what the app marks public (s-maxage), never a personal answer or one with Set-Cookie.
			proxy_cache public_answers;
			proxy_cache_key "$scheme$http_host$request_uri|$http_accept_language";
			proxy_cache_bypass $personal;
			proxy_no_cache $personal;
			# No proxy_cache_lock: requests waiting on a lock poll every 500 ms, and most answers
			# (personal, or not marked public) are never stored, so every one would wait. No
			# "updating" either: an answer that stops being public (a page taken down) is never
			# stored again, so its old copy would be served stale for as long as it is read. A stale
			# copy stands in only when no app process answers.
			proxy_cache_revalidate on;
			proxy_cache_use_stale error timeout http_502 http_503 http_504;
			add_header X-Edge-Cache $upstream_cache_status always;
		}
	}
}
`;
}

export async function startNginx(e, appPorts) {
	const bin = which('nginx');
	if (!bin) fail('nginx is not installed', 'Install it with: sudo apt-get install -y nginx-light');
	const pidFile = path.join(e.RUN_DIR, 'nginx.pid');
	await stopStale(pidFile, 'nginx', 'nginx');
	for (const d of ['body', 'proxy', 'fastcgi', 'uwsgi', 'scgi', 'cache'])
		fs.mkdirSync(path.join(e.RUN_DIR, 'nginx', d), { recursive: true });
	const conf = path.join(e.RUN_DIR, 'nginx.conf');
	fs.writeFileSync(
		conf,
		nginxConfig({
			port: e.PORT,
			appPorts,
			runDir: e.RUN_DIR,
			buildDir: e.BUILD_DIR,
			asRoot: process.getuid?.() === 0,
			withBrotli: brotli()
		})
	);
	const child = spawn(
		bin,
		['-p', e.RUN_DIR, '-c', conf, '-e', path.join(e.RUN_DIR, 'nginx-error.log')],
		{
			detached: true,
			stdio: ['ignore', 'ignore', 'inherit']
		}
	);
	if (!(await waitForPort(Number(e.PORT), 10_000, child)))
		fail('nginx did not start', `See ${path.join(e.RUN_DIR, 'nginx-error.log')}`);
	return { pid: child.pid, child, stop: () => stopPid(readPid(pidFile) ?? child.pid) };
}

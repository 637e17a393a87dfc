import { describe, expect, it } from 'vitest';
import { nginxConfig } from '../../scripts/lib/nginx.js';
import { identifiersInline } from '../../src/lib/server/db/limit-store';
import { GTID_POSITION, READS } from '../../src/lib/server/db/replica';

describe('the rate-limit store client', () => {
	it('puts `??` identifiers into the text, quoted, and keeps `?` values in order', () => {
		// The `mysql` driver's placeholder rules (its README, "Escaping query identifiers"):
		// `??` is an identifier, `?` a value.
		const [sql, values] = identifiersInline('SELECT points FROM ??.?? WHERE `key` = ? AND x > ?', [
			'squishline',
			'rate_limits',
			'k1',
			5
		]);
		expect(sql).toBe('SELECT points FROM `squishline`.`rate_limits` WHERE `key` = ? AND x > ?');
		expect(values).toEqual(['k1', 5]);
		expect(identifiersInline('SELECT ??', ['a`b'])[0]).toBe('SELECT `a``b`');
	});
});

describe('replica routing rules', () => {
	it('reads a binlog position as MariaDB writes it (domain-server-sequence, comma-separated)', () => {
		// MariaDB Knowledge Base, "Global Transaction ID": a GTID is domain_id-server_id-seq_no.
		for (const ok of ['0-1-512', '0-1-512,1-2-3']) expect(GTID_POSITION.test(ok)).toBe(true);
		for (const bad of ['', '0-1', "0-1-2'; DROP", '0-1-2,'])
			expect(GTID_POSITION.test(bad)).toBe(false);
	});

	it('tells statements that only read from the ones that write', () => {
		for (const r of [
			'SELECT 1',
			' (SELECT 1)',
			'show tables',
			'WITH x AS (SELECT 1) SELECT * FROM x'
		])
			expect(READS.test(r)).toBe(true);
		for (const w of [
			'UPDATE t SET a = 1',
			'INSERT INTO t VALUES (1)',
			'DELETE FROM t',
			'selection'
		])
			expect(READS.test(w)).toBe(false);
	});
});

describe('the edge configuration', () => {
	const conf = nginxConfig({
		port: '3500',
		appPorts: [3501, 3502],
		runDir: '/run/x',
		buildDir: '/app/build',
		asRoot: false,
		withBrotli: true
	});

	it('balances over every app process and retries only what was never sent', () => {
		expect(conf).toContain('server 127.0.0.1:3501');
		expect(conf).toContain('server 127.0.0.1:3502');
		expect(conf).toMatch(/proxy_next_upstream error timeout http_502;/);
		expect(conf).not.toContain('non_idempotent');
	});

	it('never shares personal answers and replaces the client address it was sent', () => {
		expect(conf).toMatch(/proxy_cache_bypass \$personal;/);
		expect(conf).toMatch(/proxy_no_cache \$personal;/);
		expect(conf).toContain('authjs\\.session-token');
		expect(conf).toContain('sl_written=');
		expect(conf).toContain('proxy_set_header X-Forwarded-For $remote_addr;');
		expect(conf).not.toContain('proxy_ignore_headers');
		// An answer that stops being public must not be served from an old copy.
		expect(conf).not.toMatch(/proxy_cache_use_stale[^;]*updating/);
		expect(conf).not.toContain('proxy_cache_background_update on');
	});

	it('serves the hashed build files itself for a year, compressed ahead', () => {
		expect(conf).toContain('alias /app/build/client/_app/immutable/;');
		expect(conf).toContain('public, max-age=31536000, immutable');
		expect(conf).toContain('gzip_static on;');
		expect(conf).toContain('brotli_static on;');
		expect(
			nginxConfig({
				...{ port: '1', appPorts: [2], runDir: '/r', buildDir: '/b', asRoot: false },
				withBrotli: false
			})
		).not.toContain('brotli');
	});
});

// Which server folder may import which: the rule DEVELOPERS.md draws, checked by ESLint's own
// `no-restricted-imports`, so `npm run check` fails on an import that points the wrong way.
// Read a line as "a module in <folder> may import from these folders" (and `env`, pure `src/lib`).

export const MAY_IMPORT = {
	// People's own changes that reach across the site.
	accounts: ['auth', 'db', 'derived', 'mail', 'review', 'sheet', 'shops', 'storage', 'text'],
	admin: ['auth', 'db', 'mail', 'review'],
	// Request handling: hooks' handles, form failures, idempotent creates.
	web: ['auth', 'db', 'mail', 'storage'],
	// Read models of whole pages, each in one SELECT of columns the domains write.
	pages: ['auth', 'comments', 'db', 'review', 'sheet', 'shops', 'stats', 'text'],
	shops: ['auth', 'db', 'derived', 'mail', 'review', 'sheet', 'storage', 'text'],
	sheet: ['auth', 'db', 'derived', 'review', 'storage', 'text'],
	stats: ['db', 'derived'],
	close: ['db', 'derived'],
	search: ['db'],
	comments: ['auth', 'db', 'mail', 'review', 'text'],
	review: ['auth', 'db', 'derived', 'mail', 'text'],
	// The derived columns: rewritten from the rows, used by the sheet, the desk, shops and stats.
	derived: ['db'],
	auth: ['db', 'mail'],
	mail: ['db'],
	storage: ['db'],
	text: [],
	db: []
};

// Loose files at the root of lib/server: env (anyone), the guard (access checks: routes, the
// API adapter and the access modules of sheet and shops), the JSON API adapter (routes only).
const GUARD_USERS = new Set(['sheet', 'shops']);

const FOLDERS = Object.keys(MAY_IMPORT);
const alt = (names) => names.join('|');

function forbidden(folder) {
	const blocked = FOLDERS.filter((f) => f !== folder && !MAY_IMPORT[folder].includes(f));
	const loose = ['api', ...(GUARD_USERS.has(folder) ? [] : ['guard'])];
	return { blocked, loose };
}

function rule(folder, depth) {
	const { blocked, loose } = forbidden(folder);
	const up = '\\.\\./'.repeat(depth);
	const patterns = [
		{
			regex: `^(${up}|\\$lib/server/)(${alt(blocked)})(/|$)`,
			message: `lib/server/${folder} may import only ${MAY_IMPORT[folder].join(', ') || 'env and pure code'} (scripts/lint/boundaries.js, DEVELOPERS.md).`
		},
		{
			regex: `^(${up}|\\$lib/server/)(${alt(loose)})$`,
			message: `lib/server/${folder} may not import ${loose.join(' or ')}: those answer HTTP requests.`
		}
	];
	return { 'no-restricted-imports': ['error', { patterns }] };
}

export const boundaries = [
	...FOLDERS.flatMap((folder) => [
		{ files: [`src/lib/server/${folder}/*.ts`], rules: rule(folder, 1) },
		{ files: [`src/lib/server/${folder}/*/**/*.ts`], rules: rule(folder, 2) }
	]),
	{
		// Routes go through services: never the models, the migrations or the derived columns.
		files: ['src/routes/**/*.ts', 'src/routes/**/*.svelte'],
		rules: {
			'no-restricted-imports': [
				'error',
				{
					patterns: [
						{
							regex: '^\\$lib/server/(db|derived)(/|$)',
							message:
								'Routes call services in their domain folder; only those reach db/ and derived/.'
						}
					]
				}
			]
		}
	},
	{
		// Pure code runs in the browser too: it never imports the server (types of its answers
		// excepted: they leave no code behind).
		files: ['src/lib/**/*.ts', 'src/lib/**/*.svelte'],
		ignores: ['src/lib/server/**'],
		rules: {
			'@typescript-eslint/no-restricted-imports': [
				'error',
				{
					patterns: [
						{
							regex: '(^\\$lib/server/|(^|/)server/)',
							allowTypeImports: true,
							message: 'Pure code in src/lib never imports src/lib/server.'
						}
					]
				}
			]
		}
	}
];

// The architecture floors (../shared/DESIGN.md), checked by `npm run check:architecture` in `npm test`.
// `$app/*` and `$env/*` are Kit's virtual modules: they stay unresolved and are matched by name.
const serverArea = '^src/lib/server/(?!db/|services/)[^/]+/';

/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
	forbidden: [
		{
			name: 'no-cycles',
			severity: 'error',
			comment: 'No import cycles between modules.',
			from: {},
			to: { circular: true }
		},
		{
			name: 'no-area-cycles',
			severity: 'error',
			comment: 'Server areas call each other one way only: no cycle between their folders.',
			scope: 'folder',
			from: { path: '^src/lib/server/' },
			to: { path: '^src/lib/server/', circular: true }
		},
		{
			name: 'routes-not-to-db-or-services',
			severity: 'error',
			comment: 'Routes call domain functions with locals.db; they never reach the database or services directly.',
			from: { path: '^src/routes/' },
			to: { path: '^src/lib/server/(db|services)/' }
		},
		{
			name: 'components-not-to-server',
			severity: 'error',
			comment: 'Components run in the browser too: no server modules, private env or $app/server.',
			from: { path: '^src/lib/components/' },
			to: { path: ['^src/lib/server/', '^src/hooks\\.server', '^\\$env/[^/]+/private', '^\\$app/server'] }
		},
		{
			name: 'drafting-self-contained',
			severity: 'error',
			comment: 'The trade computation is pure: nothing of ours outside src/lib/drafting, no $app or $env.',
			from: { path: '^src/lib/drafting/' },
			to: { path: ['^src/', '^\\$app/', '^\\$env/'], pathNot: '^src/lib/drafting/' }
		},
		{
			name: 'src-not-to-docker',
			severity: 'error',
			comment: 'The local stand-ins are never part of the application.',
			from: { path: '^src/' },
			to: { path: '^docker/' }
		},
		{
			name: 'src-not-to-scripts-or-tests',
			severity: 'error',
			comment: 'Application code never reaches into scripts or tests (specs may use the test factories).',
			from: { path: '^src/', pathNot: '\\.spec\\.ts$' },
			to: { path: ['^scripts/', '^tests/'] }
		},
		{
			name: 'server-not-up',
			severity: 'error',
			comment: 'Arrows point down: server code never imports routes, components or hooks.',
			from: { path: '^src/lib/server/' },
			to: { path: ['^src/routes/', '^src/lib/components/', '^src/hooks\\.'] }
		},
		{
			name: 'db-and-services-not-to-areas',
			severity: 'error',
			comment: 'The database and the service clients sit below every area.',
			from: { path: '^src/lib/server/(db|services)/' },
			to: { path: serverArea }
		},
		{
			name: 'areas-take-db-as-argument',
			severity: 'error',
			comment:
				'Domain functions receive the database handle (db: Executor) from their caller; only its type may be imported.',
			from: { path: serverArea, pathNot: areaGlue() },
			to: { path: '^src/lib/server/db/index\\.ts$', dependencyTypesNot: ['type-only'] }
		},
		{
			name: 'areas-without-app-or-env',
			severity: 'error',
			comment:
				'Domain code never reads $app or $env, so scripts, jobs and tests call the same functions. Exceptions in areaGlue().',
			from: { path: serverArea, pathNot: areaGlue() },
			to: { path: ['^\\$app/', '^\\$env/'] }
		},
		{
			name: 'no-unresolvable',
			severity: 'error',
			comment: 'An import the checker cannot resolve would slip past every rule above.',
			from: {},
			to: { couldNotResolve: true, pathNot: ['^\\$app/', '^\\$env/'] }
		}
	],
	options: {
		includeOnly: ['^(src|scripts|tests|docker)/', '^\\$(app|env)/'],
		doNotFollow: { path: 'node_modules' },
		tsPreCompilationDeps: true,
		tsConfig: { fileName: 'tsconfig.depcruise.json' },
		enhancedResolveOptions: {
			exportsFields: ['exports'],
			conditionNames: ['import', 'require', 'node', 'default', 'types'],
			extensions: ['.ts', '.js', '.svelte', '.d.ts', '.json'],
			mainFields: ['module', 'main', 'types']
		},
		reporterOptions: { text: { highlightFocused: true } }
	}
};

/** Server modules that are glue to SvelteKit or configuration rather than domain rules, and so may use $app / $env. */
function areaGlue() {
	return [
		// Auth.js needs its secret and providers configured from env, and its handle runs in the request.
		'^src/lib/server/auth/index\\.ts$',
		// requireUser()/requireRole() read the current request through getRequestEvent().
		'^src/lib/server/auth/guard\\.ts$',
		// The hook that loads the signed-in user per request.
		'^src/lib/server/auth/handle\\.ts$',
		// The public origin for mailed links comes from configuration (ORIGIN / AUTH_URL), never the request.
		'^src/lib/server/auth/origin\\.ts$',
		// The development inbox reads where the mail stand-in listens; it is compiled only into dev and test builds.
		'^src/lib/server/dev/'
	];
}

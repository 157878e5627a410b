/**
 * `npm start`: PostgreSQL (installed when missing), migrations, demo data, local stand-ins for the
 * hosted services, a production build when out of date, and Tackline at http://localhost:3000.
 * `npm run dev` does the same with `vite dev` instead of the build. Ctrl-C stops everything.
 */
import { join } from 'node:path';
import { startStandins } from '../docker/standins';
import {
	buildIfNeeded,
	log,
	migrateAndSeed,
	persistentSecret,
	root,
	startDatabase,
	startServer,
	stopProcess,
	uploadBodySizeLimit
} from './lib/local';

const dev = process.argv.includes('--dev');
// The development inbox is in `npm run dev`, and in `npm start` only when asked for.
const devTools = dev || process.env.TACKLINE_DEV_TOOLS === '1';
// Loopback unless told otherwise: a demo instance is not for the whole network.
const host = process.env.HOST ?? '127.0.0.1';
const dataDir = join(root, '.data');
const port = Number(process.env.PORT ?? (dev ? 5173 : 3000));
const origin = `http://localhost:${port}`;

const database = await startDatabase({
	dataDir: join(dataDir, 'pg', 'data'),
	port: Number(process.env.TACKLINE_PG_PORT ?? 54329),
	user: 'tackline',
	password: persistentSecret(dataDir, 'pg-password'),
	database: 'tackline'
});
const standins = await startStandins(
	{
		smtp: Number(process.env.TACKLINE_SMTP_PORT ?? 2525),
		mailApi: Number(process.env.TACKLINE_MAIL_API_PORT ?? 2526),
		s3: Number(process.env.TACKLINE_S3_PORT ?? 2527),
		search: Number(process.env.TACKLINE_SEARCH_PORT ?? 7701),
		stripe: Number(process.env.TACKLINE_STRIPE_PORT ?? 2528)
	},
	{
		s3DataDir: join(dataDir, 's3'),
		// Payments made in the demo outlive a restart, as the database that refers to them does.
		stripeStateFile: join(dataDir, 'stripe.json'),
		stripeWebhookUrl: `${origin}/api/v1/webhooks/stripe`,
		stripeWebhookSecret: `whsec_${persistentSecret(dataDir, 'stripe-webhook-secret')}`,
		stripeSecretKey: `sk_test_${persistentSecret(dataDir, 'stripe-secret-key')}`
	}
);
// The seed stores demo photos in the S3 stand-in, so it runs once the stand-ins are up.
Object.assign(process.env, standins.env);
// The demo orders' payment pages and notices link back to the app.
process.env.ORIGIN = origin;
await migrateAndSeed(database.url, { seed: true });
if (!dev) await buildIfNeeded({ devTools });

const server = startServer(
	{
		...standins.env,
		DATABASE_URL: database.url,
		AUTH_SECRET: persistentSecret(dataDir, 'auth-secret'),
		AUTH_TRUST_HOST: 'true',
		ORIGIN: origin,
		PORT: String(port),
		HOST: host,
		BODY_SIZE_LIMIT: uploadBodySizeLimit
	},
	dev ? join(root, 'node_modules/.bin/vite') : 'node',
	dev ? ['dev', '--host', host, '--port', String(port), '--strictPort'] : ['build']
);
log(
	`Tackline is starting at ${origin} (listening on ${host}) — demo sign-ins are listed in README.md; Ctrl-C stops it`
);

let stopping = false;
async function shutdown(code: number) {
	if (stopping) return;
	stopping = true;
	log('Stopping…');
	await stopProcess(server);
	await standins.stop();
	database.stop();
	process.exit(code);
}
process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));
server.on('exit', (code) => void shutdown(code ?? 0));

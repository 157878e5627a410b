/**
 * `npm run admin:create -- --email someone@example.com --name "Some One"`: the only way, besides the
 * demo seed, to make an administrator. Prints a generated password unless ADMIN_PASSWORD is set.
 */
import './lib/kit-modules';
import { randomBytes } from 'node:crypto';
import { parseArgs } from 'node:util';
import { createDb } from '../src/lib/server/db/client';

const { values } = parseArgs({ options: { email: { type: 'string' }, name: { type: 'string' } } });
const url = process.env.DATABASE_URL;
if (!url || !values.email) {
	console.error('Usage: DATABASE_URL=… npm run admin:create -- --email someone@example.com [--name "Some One"]');
	process.exit(1);
}

// Loaded after the hooks above are registered: domain code imports `$lib/…` and Kit modules.
const accounts = await import('../src/lib/server/accounts');
const { email: emailSchema, newPassword } = await import('../src/lib/server/accounts/schemas');
const { passwordWeakness } = await import('../src/lib/server/accounts/password-policy');

const email = emailSchema.safeParse(values.email);
if (!email.success) {
	console.error(email.error.issues[0].message);
	process.exit(1);
}
const password = process.env.ADMIN_PASSWORD ?? randomBytes(18).toString('base64url');
const problem =
	newPassword.safeParse(password).error?.issues[0].message ?? passwordWeakness(password, { email: email.data });
if (problem) {
	console.error(`ADMIN_PASSWORD: ${problem}`);
	process.exit(1);
}

const { db, pool } = createDb(url, { max: 1 });
try {
	await accounts.ensureAdmin(db, { email: email.data, name: values.name ?? 'Administrator', password });
} finally {
	await pool.end();
}
console.log(`Administrator ${email.data} is ready.${process.env.ADMIN_PASSWORD ? '' : ` Password: ${password}`}`);

/**
 * `npm run admin:create -- --email someone@example.com --name "Some One"`: the only way, besides the
 * demo seed, to make an administrator. Prints a generated password unless ADMIN_PASSWORD is set.
 */
import { randomBytes } from 'node:crypto';
import { parseArgs } from 'node:util';
import { createDb } from '../src/lib/server/db/client';
import { auditEvent, user } from '../src/lib/server/db/schema';
import { hashPassword, MIN_PASSWORD_LENGTH } from '../src/lib/server/auth/password';

const { values } = parseArgs({ options: { email: { type: 'string' }, name: { type: 'string' } } });
const url = process.env.DATABASE_URL;
if (!url || !values.email) {
	console.error('Usage: DATABASE_URL=… npm run admin:create -- --email someone@example.com [--name "Some One"]');
	process.exit(1);
}
const password = process.env.ADMIN_PASSWORD ?? randomBytes(12).toString('base64url');
if (password.length < MIN_PASSWORD_LENGTH) {
	console.error(`ADMIN_PASSWORD must have at least ${MIN_PASSWORD_LENGTH} characters.`);
	process.exit(1);
}

const { db, pool } = createDb(url, { max: 1 });
const email = values.email.trim().toLowerCase();
const passwordHash = await hashPassword(password);
await db.transaction(async (tx) => {
	const [admin] = await tx
		.insert(user)
		.values({ email, name: values.name ?? 'Administrator', role: 'admin', passwordHash })
		.onConflictDoUpdate({ target: user.email, set: { role: 'admin', passwordHash, suspendedAt: null } })
		.returning({ id: user.id });
	await tx.insert(auditEvent).values({
		actorId: null,
		action: 'account.made_admin',
		subjectType: 'user',
		subjectId: admin.id,
		data: { via: 'cli' }
	});
});
await pool.end();
console.log(`Administrator ${email} is ready.${process.env.ADMIN_PASSWORD ? '' : ` Password: ${password}`}`);

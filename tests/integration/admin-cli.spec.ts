import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { expect, it } from 'vitest';
import { newClient, signIn, uniqueEmail } from './http';

const run = promisify(execFile);

it('makes an administrator from the command line, who then reaches the desk', async () => {
	const email = uniqueEmail('ops');
	const { stdout } = await run(
		'node_modules/.bin/tsx',
		['scripts/create-admin.ts', '--email', email, '--name', 'Ops Person'],
		{
			env: { ...process.env, ADMIN_PASSWORD: 'a strong admin password' }
		}
	);
	expect(stdout).toContain(`Administrator ${email} is ready.`);
	expect(stdout).not.toContain('a strong admin password');

	const client = newClient();
	const response = await signIn(client, email, 'a strong admin password');
	expect(response.headers.get('location')).toBe('/desk');
	expect((await client.get('/desk')).status).toBe(200);
});

import { describe, expect, it } from 'vitest';
import { describeForLog, redact } from './redact';

describe('redact', () => {
	it('takes e-mail addresses and password hashes out of log text', () => {
		const hash = '$argon2id$v=19$m=19456,t=2,p=1$c2FsdHNhbHQ$aGFzaGhhc2hoYXNo';
		const text = redact(`user ada@example.test has ${hash}`);
		expect(text).toBe('user [email] has [password hash]');
	});

	it("drops a failed query's parameters and PostgreSQL's repeated key values", () => {
		const error = new Error(
			'Failed query: insert into "user" ("email", "password_hash") values ($1, $2)\nparams: ada@example.test,secret',
			{
				cause: Object.assign(new Error('duplicate key value violates unique constraint'), {
					detail: 'Key (email)=(ada@example.test) already exists.'
				})
			}
		);
		const logged = describeForLog(error);
		expect(logged).toContain('Failed query: insert into "user"');
		expect(logged).toContain('params: [redacted]');
		expect(logged).toContain('Key (email)=([redacted]) already exists.');
		expect(logged).not.toContain('ada@example.test');
		expect(logged).not.toContain('secret');
	});
});

import { describe, expect, it } from 'vitest';
import { openApi } from './index';

describe('the API document', () => {
	it('builds', async () => {
		const { document } = openApi();
		(await import('node:fs')).writeFileSync('/tmp/openapi-doc.json', JSON.stringify(document, null, 1));
		expect(document.openapi).toBe('3.1.0');
	});
});

import { deserialize } from '$app/forms';
import type { ActionResult } from '@sveltejs/kit';

/**
 * Posts a form to a SvelteKit form action with XMLHttpRequest, whose `upload.onprogress` (unlike fetch) reports
 * the bytes sent, and reads the action's answer as `use:enhance` would. `onProgress` gets whole percentages.
 */
export function postWithProgress(
	action: string,
	body: FormData,
	onProgress: (percent: number) => void
): Promise<ActionResult> {
	return new Promise((resolve) => {
		const xhr = new XMLHttpRequest();
		xhr.open('POST', action);
		xhr.setRequestHeader('accept', 'application/json');
		xhr.setRequestHeader('x-sveltekit-action', 'true');
		xhr.upload.onprogress = (event) => {
			if (event.lengthComputable) onProgress(Math.min(99, Math.floor((event.loaded / event.total) * 100)));
		};
		xhr.onload = () => {
			onProgress(100);
			try {
				resolve(deserialize(xhr.responseText));
			} catch {
				resolve({ type: 'error', status: xhr.status, error: new Error(`The upload failed (${xhr.status}).`) });
			}
		};
		xhr.onerror = () =>
			resolve({
				type: 'error',
				status: 0,
				error: new Error('The upload was interrupted. Check your connection and try again.')
			});
		xhr.send(body);
	});
}

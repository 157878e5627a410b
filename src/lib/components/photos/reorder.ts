/** Saves a new photo order through the list's JSON API; the message to show when it fails, else null. */
export async function reorderPhotos(apiUrl: string, order: string[]): Promise<string | null> {
	try {
		const response = await fetch(apiUrl, {
			method: 'PATCH',
			headers: { 'content-type': 'application/json', accept: 'application/json' },
			body: JSON.stringify({ order })
		});
		if (response.ok) return null;
		const body = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
		return body?.error?.message ?? 'The new order could not be saved. Please try again.';
	} catch {
		return 'The new order could not be saved: the connection was lost. Please try again.';
	}
}

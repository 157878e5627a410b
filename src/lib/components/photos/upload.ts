import type { PhotoView } from '$lib/types/photos';

/** One file in the upload list: its progress, and why it was refused. */
export type QueuedUpload = {
	key: number;
	name: string;
	progress: number;
	state: 'waiting' | 'uploading' | 'done' | 'refused';
	message?: string;
};

export type UploadResult = { ok: true; photo: PhotoView } | { ok: false; message: string };

/** The largest file the server takes; larger ones are refused here before any byte is sent. */
export const maxFileBytes = 15 * 1024 * 1024;

function errorMessage(xhr: XMLHttpRequest) {
	try {
		const body = JSON.parse(xhr.responseText) as { error?: { message?: string } };
		if (body.error?.message) return body.error.message;
	} catch {
		// not JSON: a proxy or the network answered
	}
	return xhr.status === 0
		? 'The upload was interrupted. Check your connection and try again.'
		: `The upload failed (${xhr.status}). Please try again.`;
}

/**
 * Sends one file as multipart `file` with XMLHttpRequest, whose `upload.onprogress` (unlike fetch)
 * reports the bytes sent; `onProgress` gets whole percentages.
 */
export function uploadFile(url: string, file: File, onProgress: (percent: number) => void): Promise<UploadResult> {
	return new Promise((resolve) => {
		const xhr = new XMLHttpRequest();
		xhr.open('POST', url);
		xhr.setRequestHeader('accept', 'application/json');
		xhr.upload.onprogress = (event) => {
			if (event.lengthComputable) onProgress(Math.min(99, Math.floor((event.loaded / event.total) * 100)));
		};
		xhr.onload = () => {
			if (xhr.status === 201) {
				onProgress(100);
				resolve({ ok: true, photo: JSON.parse(xhr.responseText) as PhotoView });
			} else resolve({ ok: false, message: errorMessage(xhr) });
		};
		xhr.onerror = () => resolve({ ok: false, message: errorMessage(xhr) });
		const body = new FormData();
		body.append('file', file);
		xhr.send(body);
	});
}

/** The tones Badge.svelte draws. */
type Tone = 'neutral' | 'info' | 'success' | 'warning' | 'danger';

/** The one place commission statuses get their words and colours. */
export const commissionStatusLabels: Record<string, { label: string; tone: Tone }> = {
	draft: { label: 'Draft', tone: 'neutral' },
	open: { label: 'Open for quotes', tone: 'info' },
	awarded: { label: 'Tailor chosen', tone: 'success' },
	closed: { label: 'Closed', tone: 'neutral' },
	cancelled: { label: 'Cancelled', tone: 'neutral' },
	expired: { label: 'Expired', tone: 'warning' }
};

export function statusOf(status: string): { label: string; tone: Tone } {
	return commissionStatusLabels[status] ?? { label: status, tone: 'neutral' };
}

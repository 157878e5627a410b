/** The tones Badge.svelte draws. */
type Tone = 'neutral' | 'info' | 'success' | 'warning' | 'danger';

/** The one place quote statuses get their words and colours, as the tailor reads them. */
export const quoteStatusLabels: Record<string, { label: string; tone: Tone; explain: string }> = {
	sent: { label: 'Waiting for an answer', tone: 'info', explain: 'The customer can accept it until it lapses.' },
	accepted: { label: 'Accepted', tone: 'success', explain: 'The customer accepted this quote.' },
	declined: { label: 'Declined', tone: 'neutral', explain: 'The customer chose not to take this quote.' },
	withdrawn: { label: 'Withdrawn', tone: 'neutral', explain: 'You took this quote back.' },
	lapsed: { label: 'Lapsed', tone: 'warning', explain: 'It passed its valid-until date without an answer.' }
};

export function quoteStatusOf(status: string) {
	return quoteStatusLabels[status] ?? { label: status, tone: 'neutral', explain: '' };
}

import { tokenize } from 'linkifyjs';

export type Segment = { kind: 'text'; text: string } | { kind: 'link'; text: string; href: string };

const allowedProtocols = new Set(['http:', 'https:', 'mailto:']);

/** The address a found link may open, or null when it is not a web or mail address. */
function safeHref(href: string): string | null {
	try {
		const url = new URL(href);
		return allowedProtocols.has(url.protocol) ? url.href : null;
	} catch {
		return null;
	}
}

/**
 * A message body cut into plain text and links, for rendering as escaped text with `<a>` elements: no
 * HTML from the body is ever interpreted, and only http(s) and mailto addresses become links.
 */
export function segments(body: string): Segment[] {
	const out: Segment[] = [];
	const push = (text: string) => {
		const last = out.at(-1);
		if (last?.kind === 'text') last.text += text;
		else out.push({ kind: 'text', text });
	};
	for (const token of tokenize(body)) {
		const text = token.toString();
		const href = token.isLink ? safeHref(token.toHref('https')) : null;
		if (href) out.push({ kind: 'link', text, href });
		else push(text);
	}
	return out;
}

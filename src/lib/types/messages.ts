/** A message as pages, the API and the live stream show it; `mine` is from the viewer's side. */
export type MessageView = {
	id: string;
	threadId: string;
	authorId: string | null;
	mine: boolean;
	body: string;
	createdAt: string;
	readAt: string | null;
	attachments: AttachmentView[];
};

/** A photo sent with a message: same-origin addresses that check the viewer takes part in the thread. */
export type AttachmentView = {
	id: string;
	url: string;
	thumbUrl: string;
	width: number | null;
	height: number | null;
	altText: string;
};

/** One conversation in someone's inbox. */
export type ThreadSummary = {
	id: string;
	commission: { id: string; title: string; status: string };
	/** Who the viewer talks to: the workroom for a customer, the customer's first name and initial for a tailor. */
	otherParty: { id: string | null; name: string; role: 'customer' | 'tailor' };
	lastMessage: { preview: string; at: string; mine: boolean; hasAttachments: boolean } | null;
	unreadCount: number;
};

/** A conversation's header: what it is about and with whom, and whether it still takes messages. */
export type ThreadView = ThreadSummary & {
	viewerRole: 'customer' | 'tailor';
	open: boolean;
	/** Why no more messages can be sent, when `open` is false. */
	closedReason: string | null;
};

export const maxMessageLength = 4000;
/** At most this many photos go with one message. */
export const maxAttachments = 4;

export function attachmentUrl(id: string, variant: 'full' | 'thumb' = 'full') {
	return `/messages/attachments/${id}/${variant}`;
}

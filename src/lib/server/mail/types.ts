/** A file sent with a mail (an `.ics` invitation); text content only, since jobs store mail as JSON. */
export type MailAttachment = { filename: string; contentType: string; content: string };

export type Mail = { to: string; subject: string; text: string; html?: string; attachments?: MailAttachment[] };

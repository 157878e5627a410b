/**
 * Conversations between a commission's customer and each tailor who quotes or asks: posting, reading,
 * the inbox and unread counts, photo attachments, the live stream and the unread-mail digest.
 */
export { openThread } from './threads';
export { post, markRead, startQuestion, messagesChannel, type Actor, type AttachmentInput } from './transitions';
export { list, threadsFor, getThread, threadIdFor, unreadCount, unreadCounts, messagesAfter } from './queries';
export { openAttachment } from './attachments';
export { openStream, openUnreadStream } from './live';
export { sendDigests, dueDigests, digestNotice, digestDelayMinutes, type Digest } from './digest';
export { MessageError, errorStatus } from './errors';
export * as schemas from './schemas';

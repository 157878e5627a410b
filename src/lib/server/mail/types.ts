export type Mail = { to: string; subject: string; text: string; html?: string };

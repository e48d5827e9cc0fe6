import { z } from 'zod';

/** A message caught by the local fake SMTP server (development, demo, tests). */
export const DevMail = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  receivedAt: z.string(),
});
export type DevMail = z.infer<typeof DevMail>;
/** Newest first. */
export const DevMailList = z.object({ messages: z.array(DevMail) });
export type DevMailList = z.infer<typeof DevMailList>;

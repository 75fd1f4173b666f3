import { z } from 'zod';

const id = (what: string) => z.uuid({ error: `Unknown ${what}.` });

export const reportParams = z.object({ jobId: id('job card') });
export const createLinkSchema = z.object({ jobId: id('job card') });
export const revokeLinkSchema = z.object({ linkId: id('customer link') });
/** A report token as it appears in /r/<token>: anything else is simply not found. */
export const tokenParams = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{43}$/) });
export const publicPhotoParams = tokenParams.extend({ photoId: id('photo') });

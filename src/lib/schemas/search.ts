import { z } from 'zod';
import { plainText } from '$lib/plan/text';

/** A search box sent in the address (admin users, the development mailbox). */
export const searchSchema = z.object({ q: plainText().trim().max(100, 'Search for at most 100 characters.').default('') });

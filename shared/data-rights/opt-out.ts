import { z } from 'zod';
import { linkTokenSchema } from '../mail/account-schemas';

/** The athlete's opt-out link: the same 32-byte base64url token as staff links, used without signing in. */
export const optOutBodySchema = z.object({ token: linkTokenSchema });
export type OptOutBody = z.infer<typeof optOutBodySchema>;

/** What the confirmation page may show to whoever holds the link: the clinic, never the person. */
export interface OptOutLinkInfo {
  clinicName: string;
}

export interface OptOutResult {
  clinicName: string;
  optedOutAt: string;
}

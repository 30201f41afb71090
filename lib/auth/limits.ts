// Sign-in limits: 10 failures for one address or 30 from one client within 15 minutes answer 429 with Retry-After.
import {
  clearFailures,
  countRecentFailures,
  recordFailure,
  secondsUntilBelowLimit,
} from "@/lib/db/sign-in-failures";
import { tooManyRequests } from "@/lib/http/errors";

export const SIGN_IN_LIMITS = { perEmail: 10, perClient: 30, windowS: 15 * 60 } as const;

/** Throws 429 (with the seconds to wait) when the address or the client has used up its failures. */
export async function assertSignInAllowed(email: string, clientIp: string): Promise<void> {
  const { perEmail, perClient, windowS } = SIGN_IN_LIMITS;
  const counts = await countRecentFailures(email, clientIp, windowS);
  let waitS = 0;
  if (counts.email >= perEmail)
    waitS = Math.max(waitS, await secondsUntilBelowLimit("email", email, perEmail, windowS));
  if (counts.clientIp >= perClient)
    waitS = Math.max(waitS, await secondsUntilBelowLimit("clientIp", clientIp, perClient, windowS));
  if (waitS > 0) throw tooManyRequests(waitS);
}

export const noteSignInFailure = (email: string, clientIp: string) => recordFailure(email, clientIp);
export const noteSignInSuccess = (email: string) => clearFailures(email);

/** The wording for forms, which cannot show a Retry-After header. */
export function retryMessage(retryAfterS: number): string {
  const min = Math.ceil(retryAfterS / 60);
  return `Too many sign-in attempts. Try again in ${min <= 1 ? "a minute" : `${min} minutes`}.`;
}

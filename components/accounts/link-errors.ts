import { isApiError } from '@/hooks/api-client';

/**
 * A redeem call failed because of the link itself (used, expired, malformed), not the password:
 * the server answers 410 for used or expired links, and a field error on `token` for a link
 * that was never one of ours.
 */
export function isLinkProblem(error: unknown): boolean {
  return isApiError(error) && (error.status === 410 || (error.status === 400 && error.fieldErrors?.token !== undefined));
}

export function linkProblemMessage(error: unknown, fallback: string): string {
  return isApiError(error) && error.status === 410 ? error.message : fallback;
}

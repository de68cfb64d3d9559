import type { SessionClaims } from '@/lib/auth/session';

let claims: SessionClaims | null = null;
export function setClaims(c: SessionClaims | null) {
  claims = c;
}
export function currentClaims() {
  return claims;
}

import { sha256 } from "@oslojs/crypto/sha2";
import { encodeBase32LowerCaseNoPadding, encodeHexLowerCase } from "@oslojs/encoding";

/** What `generateSecret` writes: 32 characters of lower-case base32. */
export const SECRET_PATTERN = /^[a-z2-7]{32}$/;

/** A fresh random secret: 20 bytes from the system's CSPRNG, base32 (32 characters). */
export function generateSecret(): string {
  const bytes = new Uint8Array(20);
  crypto.getRandomValues(bytes);
  return encodeBase32LowerCaseNoPadding(bytes);
}

/** SHA-256 of a secret, hex: what the database stores in place of the secret itself. */
export function hashSecret(secret: string): string {
  return encodeHexLowerCase(sha256(new TextEncoder().encode(secret)));
}

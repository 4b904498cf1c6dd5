// Access tokens: short-lived HS256 JWTs (algorithm pinned, issuer and audience checked).
// Refresh tokens: opaque random strings; only their SHA-256 is stored.
import { createHash, randomBytes } from "node:crypto";
import { SignJWT, jwtVerify } from "jose";

export const issuer = "equipot";
export const audience = "equipot-api";
const algorithm = "HS256";

export interface AccessClaims {
  userId: string;
}

export function createTokenService(secret: string, accessTtlS: number) {
  const key = new TextEncoder().encode(secret);
  // Imported once: given raw bytes, jose imports the key again for every token it checks.
  let verifyKey: Promise<CryptoKey> | undefined;
  const keyForVerify = () =>
    (verifyKey ??= crypto.subtle.importKey("raw", key, { name: "HMAC", hash: "SHA-256" }, false, [
      "verify",
    ]));
  return {
    async signAccess(userId: string): Promise<string> {
      return new SignJWT({ typ: "access" })
        .setProtectedHeader({ alg: algorithm, typ: "JWT" })
        .setSubject(userId)
        .setIssuer(issuer)
        .setAudience(audience)
        .setIssuedAt()
        .setNotBefore("0s")
        .setExpirationTime(`${accessTtlS}s`)
        .sign(key);
    },
    /** Returns the claims, or undefined for any token that is not a valid, current access token. */
    async verifyAccess(token: string): Promise<AccessClaims | undefined> {
      try {
        const { payload } = await jwtVerify(token, await keyForVerify(), {
          algorithms: [algorithm],
          issuer,
          audience,
          requiredClaims: ["exp", "sub"],
        });
        if (payload.typ !== "access" || typeof payload.sub !== "string") return undefined;
        return { userId: payload.sub };
      } catch {
        return undefined;
      }
    },
  };
}
export type TokenService = ReturnType<typeof createTokenService>;

export const newOpaqueToken = () => randomBytes(32).toString("base64url");
export const hashOpaqueToken = (token: string) => createHash("sha256").update(token).digest("hex");

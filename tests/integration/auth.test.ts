import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { SignJWT, base64url } from "jose";
import { createTestContext, signInAs, withHeader, type TestContext } from "../helpers/app";
import { demoAccounts, demoPassword } from "../../server/seed/demo";
import { issuer, audience } from "../../server/services/tokens";

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

const signIn = (email: string, password: string) =>
  withHeader(request(ctx.app).post("/api/auth/sign-in")).send({ email, password });

describe("sign-in", () => {
  it.each(demoAccounts.map((a) => [a.role, a.email] as const))(
    "signs in the %s demo account",
    async (role, email) => {
      const res = await signIn(email, demoPassword);
      expect(res.status).toBe(200);
      expect(res.body.user.email).toBe(email);
      expect(res.body.memberships).toContainEqual(
        expect.objectContaining({ role, campaignName: expect.stringContaining("Kestrel") }),
      );
      const cookie = String(res.headers["set-cookie"]);
      expect(cookie).toMatch(/equipot_refresh=/);
      expect(cookie).toMatch(/HttpOnly/);
      expect(cookie).toMatch(/SameSite=Strict/);
      expect(cookie).toMatch(/Path=\/api\/auth/);
    },
  );

  it("answers a wrong password and an unknown e-mail with the same 401", async () => {
    const wrong = await signIn("field@demo.equipot.test", "not-the-password");
    const unknown = await signIn("nobody@demo.equipot.test", "not-the-password");
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error).toEqual({
      code: "unauthenticated",
      message: "E-mail or password is wrong",
    });
  });

  it("names the bad field for an invalid payload", async () => {
    const res = await signIn("not-an-email", "x");
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("validation_failed");
    expect(res.body.error.details).toContainEqual(expect.objectContaining({ path: "email" }));
  });

  it("refuses a sign-in without the same-origin header or from another site", async () => {
    const bare = await request(ctx.app)
      .post("/api/auth/sign-in")
      .send({ email: "field@demo.equipot.test", password: demoPassword });
    expect(bare.status).toBe(403);
    const crossSite = await signIn("field@demo.equipot.test", demoPassword).set(
      "Sec-Fetch-Site",
      "cross-site",
    );
    expect(crossSite.status).toBe(403);
    const foreignOrigin = await signIn("field@demo.equipot.test", demoPassword).set(
      "Origin",
      "http://evil.example",
    );
    expect(foreignOrigin.status).toBe(403);
  });

  it("takes about as long for an unknown e-mail as for a wrong password (no account probing)", async () => {
    const time = async (email: string) => {
      const t0 = performance.now();
      const res = await signIn(email, "not-the-password");
      expect(res.status).toBe(401);
      return { ms: performance.now() - t0, message: res.body.error.message as string };
    };
    // Below the account's free failures, so no throttle answers early; alternating.
    const known: number[] = [];
    const unknown: number[] = [];
    const messages = new Set<string>();
    for (let i = 0; i < 4; i++) {
      const a = await time("geodesist@demo.equipot.test");
      const b = await time(`nobody-${i}@demo.equipot.test`);
      known.push(a.ms);
      unknown.push(b.ms);
      messages.add(a.message).add(b.message);
    }
    expect(messages.size).toBe(1);
    const median = (v: number[]) => [...v].sort((x, y) => x - y)[Math.floor(v.length / 2)] ?? 0;
    // A skipped hash would make the unknown e-mail about 20× faster (argon2id takes tens of ms).
    expect(median(unknown) / median(known)).toBeGreaterThan(0.5);
    expect(median(unknown) / median(known)).toBeLessThan(2);
  });

  it("throttles repeated failures for one account before hashing, with Retry-After", async () => {
    const email = "reviewer@demo.equipot.test";
    const statuses: number[] = [];
    for (let i = 0; i < 7; i += 1) statuses.push((await signIn(email, `wrong-${i}`)).status);
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    const blocked = await signIn(email, demoPassword);
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers["retry-after"])).toBeGreaterThan(0);
  });
});

describe("access tokens", () => {
  const me = (token: string) =>
    request(ctx.app).get("/api/auth/me").set("Authorization", `Bearer ${token}`);

  it("accepts a fresh token and refuses none", async () => {
    const { token } = await signInAs(ctx.app, "field");
    expect((await me(token)).status).toBe(200);
    expect((await request(ctx.app).get("/api/auth/me")).status).toBe(401);
  });

  it("refuses tampered, expired, alg:none and wrongly signed tokens", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const [header, payload, signature] = token.split(".");
    const claims = JSON.parse(new TextDecoder().decode(base64url.decode(payload ?? "")));
    const forged = base64url.encode(
      JSON.stringify({ ...claims, sub: "00000000-0000-4000-8000-000000000000" }),
    );
    const tampered = `${header}.${forged}.${signature}`;
    const none = `${base64url.encode(JSON.stringify({ alg: "none", typ: "JWT" }))}.${payload}.`;
    const key = new TextEncoder().encode(ctx.config.JWT_SECRET);
    const expired = await new SignJWT({ typ: "access" })
      .setProtectedHeader({ alg: "HS256" })
      .setSubject(claims.sub)
      .setIssuer(issuer)
      .setAudience(audience)
      .setIssuedAt(Math.floor(Date.now() / 1000) - 3600)
      .setExpirationTime(Math.floor(Date.now() / 1000) - 60)
      .sign(key);
    const otherKey = await new SignJWT({ typ: "access" })
      .setProtectedHeader({ alg: "HS256" })
      .setSubject(claims.sub)
      .setIssuer(issuer)
      .setAudience(audience)
      .setExpirationTime("5m")
      .sign(new TextEncoder().encode("another-secret-another-secret-another-secret"));
    const wrongAudience = await new SignJWT({ typ: "access" })
      .setProtectedHeader({ alg: "HS256" })
      .setSubject(claims.sub)
      .setIssuer(issuer)
      .setAudience("someone-else")
      .setExpirationTime("5m")
      .sign(key);
    for (const bad of [tampered, none, expired, otherKey, wrongAudience, "garbage"]) {
      const res = await me(bad);
      expect(res.status, bad.slice(0, 40)).toBe(401);
      expect(res.body.error.code).toBe("unauthenticated");
    }
  });

  it("refuses a wrong issuer, a token not valid yet, another algorithm, another type and a refresh token", async () => {
    const session = await signInAs(ctx.app, "field");
    const { sub } = JSON.parse(
      new TextDecoder().decode(base64url.decode(session.token.split(".")[1] ?? "")),
    ) as { sub: string };
    const key = new TextEncoder().encode(ctx.config.JWT_SECRET);
    const now = Math.floor(Date.now() / 1000);
    // Each differs from a good token in one thing only.
    const make = (change: { alg?: string; iss?: string; nbf?: number; typ?: string }) =>
      new SignJWT({ typ: change.typ ?? "access" })
        .setProtectedHeader({ alg: change.alg ?? "HS256" })
        .setSubject(sub)
        .setIssuer(change.iss ?? issuer)
        .setAudience(audience)
        .setNotBefore(change.nbf ?? now - 1)
        .setExpirationTime(now + 300)
        .sign(key);
    expect((await me(await make({}))).status).toBe(200);
    const refreshToken = decodeURIComponent(session.cookie.split("=")[1] ?? "");
    const bad = {
      wrongIssuer: await make({ iss: "someone-else" }),
      notYetValid: await make({ nbf: now + 600 }),
      hs512: await make({ alg: "HS512" }),
      refreshType: await make({ typ: "refresh" }),
      refreshToken,
    };
    for (const [name, token] of Object.entries(bad)) {
      const res = await me(token);
      expect(res.status, name).toBe(401);
      expect(res.body.error.code, name).toBe("unauthenticated");
    }
  });
});

describe("refresh tokens", () => {
  const refresh = (cookie: string) =>
    withHeader(request(ctx.app).post("/api/auth/refresh")).set("Cookie", cookie);
  const cookieOf = (res: request.Response) =>
    String(
      [res.headers["set-cookie"]].flat().find((c) => String(c).startsWith("equipot_refresh=")),
    ).split(";")[0] ?? "";

  it("rotates, and revokes the whole family when a rotated token is used again", async () => {
    const first = await signInAs(ctx.app, "logistics");
    const second = await refresh(first.cookie);
    expect(second.status).toBe(200);
    expect(second.body.accessToken).toEqual(expect.any(String));
    const secondCookie = cookieOf(second);
    expect(secondCookie).not.toBe(first.cookie);

    const reuse = await refresh(first.cookie);
    expect(reuse.status).toBe(401);
    // The thief's replay also ends the legitimate holder's session.
    expect((await refresh(secondCookie)).status).toBe(401);
  });

  it("refuses a refresh without the same-origin header", async () => {
    const session = await signInAs(ctx.app, "geodesist");
    const res = await request(ctx.app).post("/api/auth/refresh").set("Cookie", session.cookie);
    expect(res.status).toBe(403);
  });

  it("ends the session on sign-out", async () => {
    const session = await signInAs(ctx.app, "geodesist");
    const out = await withHeader(request(ctx.app).post("/api/auth/sign-out")).set(
      "Cookie",
      session.cookie,
    );
    expect(out.status).toBe(204);
    expect((await refresh(session.cookie)).status).toBe(401);
  });
});

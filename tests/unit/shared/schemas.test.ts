import { describe, expect, it } from "vitest";
import { siteCreateInput, siteUpdateInput } from "../../../shared/schemas/sites";
import { signInInput } from "../../../shared/schemas/auth";

const site = {
  name: "Hut",
  kind: "mountain",
  latitudeDeg: 46.5,
  longitudeDeg: 8.1,
  approxHeightM: 2400,
};

describe("site schemas", () => {
  it("accepts a plausible site and fills notes", () => {
    expect(siteCreateInput.parse(site)).toEqual({ ...site, notes: "" });
  });

  it.each([
    ["latitudeDeg", 90.5, "Latitude must be between −90° and 90°"],
    ["longitudeDeg", -181, "Longitude must be between −180° and 180°"],
    ["approxHeightM", 9001, "Approximate height must be between -500 m and 9000 m"],
    ["approxHeightM", Number.NaN, "Approximate height must be a number"],
    ["name", "  ", "Name is required"],
    ["kind", "volcano", undefined],
  ])("refuses %s = %s with a message naming the field", (field, value, message) => {
    const result = siteCreateInput.safeParse({ ...site, [field]: value });
    expect(result.success).toBe(false);
    const issue = result.error?.issues.find((i) => i.path[0] === field);
    expect(issue).toBeDefined();
    if (message) expect(issue?.message).toBe(message);
  });

  it("refuses server-owned fields by name", () => {
    const result = siteCreateInput.safeParse({
      ...site,
      version: 7,
      campaignId: crypto.randomUUID(),
    });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]).toMatchObject({
      code: "unrecognized_keys",
      keys: ["version", "campaignId"],
    });
  });

  it("requires the base version on edit", () => {
    expect(siteUpdateInput.safeParse({ name: "x" }).success).toBe(false);
    expect(siteUpdateInput.parse({ baseVersion: 3, name: "x" })).toEqual({
      baseVersion: 3,
      name: "x",
    });
  });
});

describe("sign-in schema", () => {
  it("normalises the e-mail", () => {
    expect(signInInput.parse({ email: "  Field@Demo.Equipot.TEST ", password: "p" }).email).toBe(
      "field@demo.equipot.test",
    );
  });
});

import { describe, expect, test } from "vitest";
import {
  formatHeightM,
  formatLatitude,
  formatLongitude,
  formatUtc,
  parseDecimal,
} from "../../../src/lib/format";

describe("parseDecimal", () => {
  test.each([
    ["46.5", 46.5],
    ["46,5", 46.5],
    [" -1.25 ", -1.25],
    ["−12.5", -12.5],
    ["+3", 3],
    [".5", 0.5],
    ["1e3", 1000],
    ["2 871", 2871],
  ])("reads %j as %d", (typed, expected) => {
    expect(parseDecimal(typed)).toBe(expected);
  });

  test.each(["", "  ", "east-ish", "1.2.3", "12m", "--1"])("gives NaN for %j", (typed) => {
    expect(parseDecimal(typed)).toBeNaN();
  });

  test("passes numbers through (values set by the form itself)", () => {
    expect(parseDecimal(212)).toBe(212);
    expect(parseDecimal(undefined)).toBeNaN();
  });
});

describe("display formats", () => {
  test("positions carry the hemisphere and five decimals", () => {
    expect(formatLatitude(47.0842)).toBe("47.08420° N");
    expect(formatLatitude(-33.5)).toBe("33.50000° S");
    expect(formatLongitude(-1.25)).toBe("1.25000° W");
    expect(formatLongitude(11.2273)).toBe("11.22730° E");
  });

  test("heights in metres without a thousands separator", () => {
    expect(formatHeightM(2871)).toBe("2871.0 m");
    expect(formatHeightM(-12.34)).toBe("-12.3 m");
  });

  test("times in UTC", () => {
    expect(formatUtc("2027-06-03T14:05:59Z")).toBe("2027-06-03 14:05 UTC");
    expect(formatUtc("not a date")).toBe("not a date");
  });
});

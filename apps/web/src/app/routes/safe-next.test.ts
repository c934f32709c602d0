import { describe, expect, it } from "vitest";
import { safeNext } from "./safe-next";

describe("safeNext", () => {
  it("returns a same-site path", () => {
    expect(safeNext("?next=%2Fmachines%3Ftab%3Dmodes")).toBe("/machines?tab=modes");
  });

  it("refuses other origins and protocol-relative URLs", () => {
    expect(safeNext("?next=https%3A%2F%2Fexample.org")).toBe("/planner");
    expect(safeNext("?next=%2F%2Fexample.org")).toBe("/planner");
    expect(safeNext("?next=%2F%5Cexample.org")).toBe("/planner");
  });

  it("falls back to the planner without a target or for the auth pages", () => {
    expect(safeNext("")).toBe("/planner");
    expect(safeNext("?next=%2Fsign-in")).toBe("/planner");
  });
});

import convert from "convert-units";
import fc from "fast-check";
import { unit } from "mathjs";
import { describe, expect, it } from "vitest";
import { convertUnit } from "./convert-unit.js";

const rel = (a: number, b: number): number => Math.abs(a / b - 1);

describe("convertUnit — against convert-units 2.3.4 (rel. tolerance 1e-5: it is not exact, domain-reference §19) and mathjs 15.2.0 (exact)", () => {
  it("mm ↔ in", () => {
    expect(rel(convertUnit({ value: 25.4, quantity: "length", from: "mm", to: "in" }), convert(25.4).from("mm").to("in"))).toBeLessThan(1e-5);
    expect(convertUnit({ value: 0.001, quantity: "length", from: "in", to: "mm" })).toBeCloseTo(unit("0.001 inch").toNumber("mm"), 15);
    expect(convertUnit({ value: 0.025, quantity: "length", from: "mm", to: "in" })).toBeCloseTo(0.025 / 25.4, 15);
  });
  it("m/min ↔ sfm (ft/min): mathjs ft/minute → m/minute = 0.3048 (domain-reference §19)", () => {
    expect(convertUnit({ value: 500, quantity: "cuttingSpeed", from: "sfm", to: "m/min" })).toBeCloseTo(unit(500, "ft/minute").toNumber("m/minute"), 12);
    // convert-units has ft/s and m/s only: 300 m/min = 5 m/s.
    expect(rel(convertUnit({ value: 300, quantity: "cuttingSpeed", from: "m/min", to: "m/s" }), convert(300 / 60).from("m/s").to("m/s"))).toBeLessThan(1e-12);
    expect(rel(convertUnit({ value: 300, quantity: "cuttingSpeed", from: "m/min", to: "sfm" }) / 60, convert(5).from("m/s").to("ft/s"))).toBeLessThan(1e-5);
  });
  it("mm/min ↔ in/min", () => {
    expect(convertUnit({ value: 1828.8, quantity: "feedRate", from: "mm/min", to: "in/min" })).toBeCloseTo(unit(1828.8, "mm/minute").toNumber("inch/minute"), 12);
  });
  it("N ↔ lbf (mathjs lbf)", () => {
    expect(convertUnit({ value: 1, quantity: "force", from: "lbf", to: "N" })).toBeCloseTo(unit("1 lbf").toNumber("N"), 12);
    expect(convertUnit({ value: 1, quantity: "force", from: "lbf", to: "N" })).toBeCloseTo(4.4482216153, 9);
  });
  it("W ↔ hp (mathjs hp = 745.69987 W) and W ↔ kW (convert-units)", () => {
    // mathjs rounds the horsepower to 745.6998715386 W; ours is exact from 550 ft·lbf/s (745.69987158227 W): 6e-11 apart.
    expect(rel(convertUnit({ value: 1, quantity: "power", from: "hp", to: "W" }), unit("1 hp").toNumber("W"))).toBeLessThan(1e-10);
    expect(convertUnit({ value: 1500, quantity: "power", from: "W", to: "kW" })).toBeCloseTo(convert(1500).from("W").to("kW"), 12);
  });
  it("N/mm ↔ lbf/in (mathjs)", () => {
    expect(convertUnit({ value: 1, quantity: "stiffness", from: "lbf/in", to: "N/mm" })).toBeCloseTo(unit("1 lbf/inch").toNumber("N/mm"), 12);
  });
  it("mm³/min ↔ in³/min (convert-units volume flow; mathjs)", () => {
    expect(rel(convertUnit({ value: 1, quantity: "volumeRate", from: "in³/min", to: "mm³/min" }), convert(1).from("in3/min").to("mm3/s") * 60)).toBeLessThan(1e-5);
    expect(convertUnit({ value: 1, quantity: "volumeRate", from: "in³/min", to: "mm³/min" })).toBeCloseTo(unit("1 inch^3").toNumber("mm^3"), 6);
  });
  it("N/mm² ↔ psi (convert-units MPa/psi) and hp·min/in³ ↔ J/mm³ = 2.730324 (mathjs, domain-reference §0)", () => {
    expect(rel(convertUnit({ value: 800, quantity: "specificForce", from: "N/mm²", to: "psi" }), convert(800).from("MPa").to("psi"))).toBeLessThan(1e-5);
    expect(convertUnit({ value: 1, quantity: "specificEnergy", from: "hp·min/in³", to: "J/mm³" })).toBeCloseTo(unit("1 hp*minute/inch^3").toNumber("J/mm^3"), 9);
    expect(convertUnit({ value: 0.63, quantity: "specificEnergy", from: "hp·min/in³", to: "J/mm³" })).toBeCloseTo(1.7201, 4);
  });
  it("kg ↔ lb (convert-units)", () => {
    expect(rel(convertUnit({ value: 10, quantity: "mass", from: "kg", to: "lb" }), convert(10).from("kg").to("lb"))).toBeLessThan(1e-5);
  });
  it("round trips exactly enough for any finite value (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e9, max: 1e9, noNaN: true }), (v) => {
        const there = convertUnit({ value: v, quantity: "stiffness", from: "N/mm", to: "lbf/in" });
        expect(convertUnit({ value: there, quantity: "stiffness", from: "lbf/in", to: "N/mm" })).toBeCloseTo(v, 6);
      }),
    );
  });
  it("rejects a unit of another quantity", () => {
    expect(() => convertUnit({ value: 1, quantity: "length", from: "mm", to: "lbf" as never })).toThrow("convertUnit requires to to be a unit of length (got lbf)");
    expect(() => convertUnit({ value: Number.NaN, quantity: "length", from: "mm", to: "in" })).toThrow("convertUnit requires value to be a finite number");
  });
});

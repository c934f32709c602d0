// Minimal typing of convert-units 2.3.4 (used only as an independent oracle in tests).
declare module "convert-units" {
  interface Converter {
    from(unit: string): { to(unit: string): number };
  }
  function convert(value: number): Converter;
  export default convert;
}

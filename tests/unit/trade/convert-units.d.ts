// Minimal types for convert-units 2.3.4 (it ships none), used only as an independent
// cross-check of the unit factors in shared/trade/units.ts.
declare module 'convert-units' {
  interface Converter {
    from(unit: string): { to(unit: string): number };
  }
  function convert(value: number): Converter;
  export default convert;
}

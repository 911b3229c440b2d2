// date-holidays ships no types for its data entry (package.json "exports": "./data").
declare module 'date-holidays/data' {
  export const data: { holidays: Record<string, unknown>; names: Record<string, unknown> };
}

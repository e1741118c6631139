// @carbon/colors 11.59 ships an index.d.ts that re-exports a file missing from the package, so its
// colour constants have no types. Declare the ones the app uses.
export {};

declare module '@carbon/colors' {
  export const blue60: string;
  export const cyan70: string;
  export const green60: string;
  export const magenta60: string;
  export const orange60: string;
  export const purple60: string;
  export const red60: string;
  export const teal50: string;
  export const yellow40: string;
  /** Every palette by hue name, then by grade (10–100). */
  export const colors: Record<string, Record<number, string>>;
}

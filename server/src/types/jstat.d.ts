/** The part of jStat (which ships no types) that the server uses. */
declare module 'jstat' {
  interface Distribution {
    pdf(x: number, ...params: number[]): number;
    cdf(x: number, ...params: number[]): number;
    inv(p: number, ...params: number[]): number;
  }
  const jStat: {
    normal: Distribution;
    lognormal: Distribution;
    beta: Distribution;
    [name: string]: unknown;
  };
  export default jStat;
}

// Minimal typings for the parts of jstat (reference statistics library) the engine tests use.
declare module 'jstat' {
  interface Distribution {
    pdf(x: number, ...parameters: number[]): number;
    cdf(x: number, ...parameters: number[]): number;
    inv(p: number, ...parameters: number[]): number;
  }
  const jStat: { normal: Distribution; chisquare: Distribution };
  export default jStat;
}

// Typings for jstat (reference statistics library used by the tests): the distributions the engine
// tests use are typed; anything else is left open for other tests.
declare module 'jstat' {
  interface Distribution {
    pdf(x: number, ...parameters: number[]): number;
    cdf(x: number, ...parameters: number[]): number;
    inv(p: number, ...parameters: number[]): number;
  }
  const jStat: {
    normal: Distribution;
    chisquare: Distribution;
    // biome-ignore lint/suspicious/noExplicitAny: untyped third-party library surface.
    [name: string]: any;
  };
  export default jStat;
}

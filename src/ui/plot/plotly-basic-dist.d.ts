// The basic bundle ships no types; load-plotly.ts checks the shape at run time.
declare module 'plotly.js-basic-dist' {
  const plotly: unknown;
  export default plotly;
}

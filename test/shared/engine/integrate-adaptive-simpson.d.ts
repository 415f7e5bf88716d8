// Types for the CommonJS numerical-integration package used by the independent J cross-check.
declare module 'integrate-adaptive-simpson' {
  function integrate(f: (x: number) => number, a: number, b: number, tol?: number, maxdepth?: number): number;
  export = integrate;
}

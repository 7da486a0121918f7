// Types for the reference integrator used in tests (the package ships none).
declare module 'integrate-adaptive-simpson' {
  /** Adaptive Simpson quadrature of f over [a, b]; tol is the error allowed per subdivision (default 1e-8). */
  export default function integrate(f: (x: number) => number, a: number, b: number, tol?: number, maxdepth?: number): number;
}

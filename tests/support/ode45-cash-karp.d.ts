// Type declarations for ode45-cash-karp 1.1 (scijs), which ships none; API as in its README.
declare module "ode45-cash-karp" {
  type Vector = number[] | Float64Array;
  interface Options {
    tol?: number;
    maxIncreaseFactor?: number;
    maxDecreaseFactor?: number;
    dtMinMag?: number;
    dtMaxMag?: number;
    verbose?: boolean;
  }
  interface Integrator {
    n: number;
    /** current state; the array passed as y0, updated in place */
    y: Vector;
    t: number;
    dt: number;
    /** one adaptive step; false once t has reached tLimit */
    step(tLimit?: number): boolean;
    /** up to n steps; false once t has reached tLimit */
    steps(n: number, tLimit?: number): boolean | undefined;
  }
  function ode45(
    y0: Vector,
    deriv: (dydt: Vector, y: Vector, t: number) => void,
    t0: number,
    dt0: number,
    options?: Options,
  ): Integrator;
  export = ode45;
}

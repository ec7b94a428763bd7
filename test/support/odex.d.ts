// Typings for the `odex` npm package (Hairer–Wanner GBS extrapolation, used in tests
// as an independent reference integrator). Its package ships TypeScript sources that
// do not compile under our strict flags, so tsconfig `paths` points here instead.
declare const odex: {
  Solver: new (n: number) => {
    absoluteTolerance: number;
    relativeTolerance: number;
    maxSteps: number;
    denseOutput: boolean;
    solve(
      f: (x: number, y: number[]) => number[],
      x0: number,
      y0: number[],
      x1: number,
      solout?: (n: number, xOld: number, x: number, y: number[]) => boolean | void,
    ): {
      y: number[];
      outcome: number;
      nStep: number;
      xEnd: number;
      nAccept: number;
      nReject: number;
      nEval: number;
    };
  };
};
export default odex;

// The package ships no types; used by the reference checks only.
declare module "integrate-adaptive-simpson" {
  export default function integrate(f: (x: number) => number, a: number, b: number, tol?: number, maxdepth?: number): number;
}

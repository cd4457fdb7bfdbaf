// The part of numeric 1.2.6 (no bundled types) that the eigensolver cross-check uses.
declare module 'numeric' {
  interface Eigen {
    lambda: { x: number[]; y?: number[] };
    E: { x: number[][]; y?: number[][] };
  }
  const numeric: { eig(a: number[][], maxit?: number): Eigen };
  export default numeric;
}

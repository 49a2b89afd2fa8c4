// jstat ships no types; only what the engine uses is declared.
declare module "jstat" {
  interface StudentT {
    cdf(x: number, dof: number): number;
    inv(p: number, dof: number): number;
  }
  const jStat: { studentt: StudentT };
  export default jStat;
}

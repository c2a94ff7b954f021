// The part of jStat's API the stats module uses (the package ships no types).
declare module "jstat" {
  interface JStat {
    normal: { inv(p: number, mean: number, sd: number): number; cdf(x: number, mean: number, sd: number): number };
    studentt: { inv(p: number, dof: number): number };
    beta: { inv(p: number, a: number, b: number): number };
    betaln(a: number, b: number): number;
    jStat?: JStat;
  }
  const jStat: JStat;
  export default jStat;
}

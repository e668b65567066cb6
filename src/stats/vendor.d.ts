// Minimal typings for the parts of jstat that plumbline calls (jstat ships no types).
declare module 'jstat' {
  interface StudentT {
    inv(p: number, dof: number): number;
    cdf(x: number, dof: number): number;
  }
  interface NoncentralT {
    cdf(x: number, dof: number, ncp: number): number;
  }
  interface JStatStatic {
    studentt: StudentT;
    noncentralt: NoncentralT;
  }
  const jStat: JStatStatic;
  export default jStat;
}

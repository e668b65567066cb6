// Minimal typings for the parts of jstat that plumbline calls (jstat ships no types).
declare module 'jstat' {
  interface StudentT {
    inv(p: number, dof: number): number;
    cdf(x: number, dof: number): number;
  }
  interface JStatStatic {
    studentt: StudentT;
  }
  const jStat: JStatStatic;
  export default jStat;
}

// The part of jstat (a general-purpose statistics library, a test-only dependency) the tests use
// to check lib/scoring/student-t.ts; the package ships no types.
declare module "jstat" {
  const jStat: {
    studentt: {
      cdf(x: number, dof: number): number;
      inv(p: number, dof: number): number;
    };
  };
  export default jStat;
}

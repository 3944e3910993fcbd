// autocannon ships no types; the bench uses only this much of it.
declare module "autocannon" {
  function autocannon(options: Record<string, unknown>): Promise<unknown>;
  export default autocannon;
}
